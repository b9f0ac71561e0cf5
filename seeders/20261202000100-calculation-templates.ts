import { db } from '@/models';
import { readTemplates } from '@/lib/governance/library';
import { createCorrelation, decideVersion, submitVersion } from '@/lib/governance/lifecycle';
import { AppError } from '@/lib/http/errors';
import { DEMO_PASSWORD, demoActor } from './20261201000100-demo-users';
import { QueryTypes } from 'sequelize';

export const name = '20261202000100-calculation-templates';

/** The content hash of a frozen correlation version, from the database (what the template pins). */
async function frozenHashes(): Promise<(slug: string, version: number) => string> {
  const rows = await db().sequelize.query<{ slug: string; version: number; content_hash: string }>(
    `SELECT c.slug, v.version, v.content_hash FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id
     WHERE c.kind = 'correlation' AND v.content_hash IS NOT NULL`, { type: QueryTypes.SELECT });
  const map = new Map(rows.map((r) => [`${r.slug}@${r.version}`, r.content_hash]));
  return (slug, version) => {
    const h = map.get(`${slug}@${version}`);
    if (!h) throw new Error(`calculation templates: ${slug} version ${version} is not in the library`);
    return h;
  };
}

/** Each template goes through the same life cycle as a correlation: drafted, validated on submission, approved by another person. */
export async function up(): Promise<void> {
  const author = await demoActor('author@demo.example');
  const approver = await demoActor('approver@demo.example');
  const { Correlation } = db();
  for (const entry of readTemplates(await frozenHashes())) {
    if (await Correlation.findOne({ where: { slug: entry.slug } })) continue;
    await createCorrelation({ actor: author, slug: entry.slug, definition: entry.definition, checkCases: entry.checkCases });
    try {
      await submitVersion({ actor: author, slug: entry.slug, version: 1 });
    } catch (err) {
      if (err instanceof AppError && err.code === 'invalid:validation-failed') {
        const issues = (err.details as { issues: { path: string; message: string }[] }).issues;
        throw new Error(`calculation template ${entry.slug} failed validation:\n  ${issues.map((i) => `${i.path}: ${i.message}`).join('\n  ')}`);
      }
      throw err;
    }
    await decideVersion({ actor: approver, slug: entry.slug, version: 1, decision: 'approve', comment: 'Template chain, regime rule and check cases reviewed against the hand calculations.', password: DEMO_PASSWORD });
  }
}

export async function down(): Promise<void> {
  const { Correlation } = db();
  await Correlation.destroy({ where: { kind: 'template' } });
}
