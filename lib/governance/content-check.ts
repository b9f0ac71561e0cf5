import { Op, QueryTypes } from 'sequelize';
import { db } from '@/models';
import { contentHash } from '@/lib/engine/canonical';
import { revisionHash } from '@/lib/calculations/records';
import { checkCasesOfVersion } from './check-cases';
import { verifyAttachments } from '@/lib/evidence/attachments';

/** Every frozen version and saved calculation revision re-hashed from what the database holds, and every evidence document they name from the store. */
export async function verifyAllContent(): Promise<{ versions: number; revisions: number; attachments: number; mismatches: string[] }> {
  const { sequelize, CalculationRevision } = db();
  const rows = await sequelize.query<{ id: number; slug: string; version: number; content_hash: string; definition: string }>(
    `SELECT v.id, c.slug, v.version, v.content_hash, v.definition FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id
     WHERE v.content_hash IS NOT NULL ORDER BY v.id`, { type: QueryTypes.SELECT });
  const mismatches: string[] = [];
  for (const r of rows) {
    if (contentHash(JSON.parse(r.definition), await checkCasesOfVersion(r.id)) !== r.content_hash) mismatches.push(`${r.slug} version ${r.version}`);
  }
  let revisions = 0;
  for (let after = 0; ;) {
    const batch = await CalculationRevision.findAll({ where: { id: { [Op.gt]: after } }, order: [['id', 'ASC']], limit: 200 });
    if (!batch.length) break;
    for (const rev of batch) {
      revisions++;
      if (revisionHash(rev.content) !== rev.contentHash) mismatches.push(`calculation ${rev.calculationId} revision ${rev.revision}`);
      after = rev.id;
    }
  }
  const documents = await verifyAttachments();
  mismatches.push(...documents.mismatches);
  return { versions: rows.length, revisions, attachments: documents.checked, mismatches };
}
