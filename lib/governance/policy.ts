import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { readSetting, saveSetting } from '@/lib/db/settings';
import { DEFAULT_POLICY, type EvidencePolicy } from '@/lib/engine/evidence';

const KEY = 'evidence-policy';

/** The evidence policy in force: what an admin set, else the default (3 independent checks of 2 kinds). */
export async function evidencePolicy(): Promise<EvidencePolicy> {
  const saved = await readSetting<Partial<EvidencePolicy>>(KEY);
  return saved ? { ...DEFAULT_POLICY, ...saved } : DEFAULT_POLICY;
}

export async function setEvidencePolicy({ actor, policy }: { actor: AuthUser; policy: EvidencePolicy }) {
  if (!actor.roles.includes('admin')) throw new AppError('forbidden:role', 'Only an admin changes the evidence policy.');
  const before = await evidencePolicy();
  await saveSetting({ key: KEY, value: policy, before, actorId: actor.id, action: 'policy.evidence-changed' });
  return policy;
}
