import { QueryTypes } from 'sequelize';
import { db, type VersionStatus } from '@/models';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { canSeeVersion } from './access';

/** What evaluation needs of a version, read in one plain query (the definition stays text until needed). */
export interface ServableVersion {
  id: number;
  version: number;
  status: VersionStatus;
  authorId: number;
  contentHash: string | null;
  withdrawnReason: string | null;
  definitionText: string;
}

/**
 * The version to evaluate: an explicit number, or the approved one. Visibility rules apply; a
 * withdrawn version is found only when pinned (it is never "approved").
 */
export async function loadServableVersion({ actor, slug, version }: { actor: AuthUser; slug: string; version?: number }): Promise<ServableVersion> {
  const { sequelize } = db();
  const [row] = await sequelize.query<{
    id: number; version: number; status: VersionStatus; author_id: number; content_hash: string | null; withdrawn_reason: string | null; definition: string;
  }>(`SELECT v.id, v.version, v.status, v.author_id, v.content_hash, v.withdrawn_reason, v.definition
      FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id
      WHERE c.slug = ? AND ${version !== undefined ? 'v.version = ?' : "v.status = 'approved'"} LIMIT 1`,
  { replacements: version !== undefined ? [slug, version] : [slug], type: QueryTypes.SELECT });
  const found = row && { id: row.id, version: row.version, status: row.status, authorId: row.author_id, contentHash: row.content_hash, withdrawnReason: row.withdrawn_reason, definitionText: row.definition };
  if (!found || !canSeeVersion(actor, found)) {
    const { Correlation } = db();
    if (!(await Correlation.findOne({ where: { slug }, attributes: ['id'] }))) throw new AppError('not_found:correlation', `No correlation "${slug}".`);
    throw version !== undefined
      ? new AppError('not_found:version', `Correlation "${slug}" has no version ${version} you can use.`)
      : new AppError('not_found:approved-version', `Correlation "${slug}" has no approved version; pin a version explicitly.`);
  }
  return found;
}
