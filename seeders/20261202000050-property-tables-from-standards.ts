import { db } from '@/models';
import { readPropertyTables } from '@/lib/governance/library';
import { createDraftVersion, decideVersion, submitVersion, updateDraft } from '@/lib/governance/lifecycle';
import { DEMO_PASSWORD, demoActor } from './20261201000100-demo-users';

export const name = '20261202000050-property-tables-from-standards';

/**
 * The air and water tables of version 1 were transcribed from memory (air's densities at 100 kPa,
 * not one atmosphere). Version 2 of each, generated from the standard formulations by
 * scripts/property-tables.py, goes through the life cycle like any new version: drafted from
 * version 1, validated on submission, approved by a second person; version 1 becomes superseded, and
 * the review's deviation chart shows the difference.
 */
export async function up(): Promise<void> {
  const author = await demoActor('author@demo.example');
  const approver = await demoActor('approver2@demo.example');
  const { Correlation, CorrelationVersion } = db();
  for (const entry of readPropertyTables()) {
    const c = await Correlation.findOne({ where: { slug: entry.slug } });
    if (!c || (await CorrelationVersion.findOne({ where: { correlationId: c.id, version: 2 } }))) continue;
    await createDraftVersion({ actor: author, slug: entry.slug, fromVersion: 1 });
    await updateDraft({ actor: author, slug: entry.slug, version: 2, definition: entry.definition, checkCases: entry.checkCases });
    await submitVersion({ actor: author, slug: entry.slug, version: 2 });
    await decideVersion({ actor: approver, slug: entry.slug, version: 2, decision: 'approve', comment: 'Generated from the standard formulations; interpolation bound and check cases reviewed; replaces the table recalled from memory.', password: DEMO_PASSWORD });
  }
}

export async function down(): Promise<void> {
  const { Correlation, CorrelationVersion } = db();
  for (const entry of readPropertyTables()) {
    const c = await Correlation.findOne({ where: { slug: entry.slug } });
    if (c) await CorrelationVersion.destroy({ where: { correlationId: c.id, version: 2 } });
  }
}
