import { db } from '@/models';
import { readLibrary } from '@/lib/governance/library';
import { createCorrelation, decideVersion, submitVersion } from '@/lib/governance/lifecycle';
import { AppError } from '@/lib/http/errors';
import type { Evidence } from '@/lib/engine/evidence';
import { DEMO_PASSWORD, demoActor } from './20261201000100-demo-users';

export const name = '20261201000200-standard-library';

/**
 * Every definition file goes through the same life cycle a person would use: drafted by the demo
 * methods engineer, validated on submission, approved by a different demo approver. A file whose
 * validation fails stops the seed with the report's problems.
 */
export async function up(): Promise<void> {
  await seedLibrary();
}

/** Seeds every library file whose slug the database does not hold yet (drafted, submitted, approved). */
export async function seedLibrary(): Promise<void> {
  const author = await demoActor('author@demo.example');
  const approver = await demoActor('approver@demo.example');
  const { Correlation } = db();
  for (const entry of readLibrary()) {
    if (await Correlation.findOne({ where: { slug: entry.slug } })) continue;
    await createCorrelation({ actor: author, slug: entry.slug, definition: entry.definition, checkCases: entry.checkCases });
    let evidence: Evidence | undefined;
    try {
      evidence = (await submitVersion({ actor: author, slug: entry.slug, version: 1 })).report.evidence;
    } catch (err) {
      if (err instanceof AppError && err.code === 'invalid:validation-failed') {
        const issues = (err.details as { issues: { path: string; message: string }[] }).issues;
        throw new Error(`standard library: ${entry.slug} failed validation:\n  ${issues.map((i) => `${i.path}: ${i.message}`).join('\n  ')}`);
      }
      throw err;
    }
    // Entries whose independent evidence is still below the policy are signed with a waiver that says so.
    const waiver = evidence && !evidence.meetsPolicy
      ? `Standard library entry below the evidence policy: ${evidence.independent} independent in-range check case(s) of ${evidence.kinds} kind(s) (${Object.entries(evidence.byKind).filter(([k]) => k !== 'transcription').map(([k, n]) => `${k} ${n}`).join(', ') || 'none'}), below ${evidence.policy.minimumIndependent} of ${evidence.policy.minimumKinds}. Approved for continuity of the library; a second kind of evidence (published data with its locator or an independent solution) is to be added before the waiver is lifted.`
      : undefined;
    await decideVersion({ actor: approver, slug: entry.slug, version: 1, decision: 'approve', comment: 'Standard library: definition, references and check cases reviewed.', password: DEMO_PASSWORD, waiver });
  }
}

export async function down(): Promise<void> {
  const { Correlation } = db();
  await Correlation.destroy({ where: { slug: readLibrary().map((e) => e.slug) } });
}
