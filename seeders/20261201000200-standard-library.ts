import { db } from '@/models';
import { readLibrary } from '@/lib/governance/library';
import { createCorrelation, decideVersion, submitVersion } from '@/lib/governance/lifecycle';
import { AppError } from '@/lib/http/errors';
import { DEMO_PASSWORD, demoActor } from './20261201000100-demo-users';

export const name = '20261201000200-standard-library';

/**
 * Every definition file goes through the same life cycle a person would use: drafted by the demo
 * methods engineer, validated on submission, approved by a different demo approver. A file whose
 * validation fails stops the seed with the report's problems.
 */
export async function up(): Promise<void> {
  const author = await demoActor('author@demo.example');
  const approver = await demoActor('approver@demo.example');
  const { Correlation } = db();
  for (const entry of readLibrary()) {
    if (await Correlation.findOne({ where: { slug: entry.slug } })) continue;
    await createCorrelation({ actor: author, slug: entry.slug, definition: entry.definition, checkCases: entry.checkCases });
    try {
      await submitVersion({ actor: author, slug: entry.slug, version: 1 });
    } catch (err) {
      if (err instanceof AppError && err.code === 'invalid:validation-failed') {
        const issues = (err.details as { issues: { path: string; message: string }[] }).issues;
        throw new Error(`standard library: ${entry.slug} failed validation:\n  ${issues.map((i) => `${i.path}: ${i.message}`).join('\n  ')}`);
      }
      throw err;
    }
    await decideVersion({ actor: approver, slug: entry.slug, version: 1, decision: 'approve', comment: 'Standard library: definition, references and check cases reviewed.', password: DEMO_PASSWORD });
  }
}

export async function down(): Promise<void> {
  const { Correlation } = db();
  await Correlation.destroy({ where: { slug: readLibrary().map((e) => e.slug) } });
}
