import { route } from '@/lib/http/handler';
import { evidencePolicyBody } from '@/lib/api/contract';
import { evidencePolicy, setEvidencePolicy } from '@/lib/governance/policy';
import { GRADE_MEANING } from '@/lib/engine/evidence';

/** The approval policy on evidence: who reads it (anyone signed in), who changes it (admins, in person). */
export const GET = route('GET /api/admin/evidence-policy', {}, async () => ({ policy: await evidencePolicy(), grades: GRADE_MEANING }));

export const PUT = route('PUT /api/admin/evidence-policy', { body: evidencePolicyBody }, async ({ caller, body }) =>
  ({ policy: await setEvidencePolicy({ actor: caller!.user, policy: body }) }));
