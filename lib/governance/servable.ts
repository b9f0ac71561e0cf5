import { QueryTypes } from 'sequelize';
import { db, type EntryKind, type VersionStatus } from '@/models';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import type { Pin } from '@/lib/engine/template-types';
import { canSeeVersion } from './access';
import { freshLoader } from '@/lib/cache/fresh';

/** What evaluation needs of a version, read in one plain query (the definition stays text until needed). */
export interface ServableVersion {
  id: number;
  slug: string;
  title: string;
  version: number;
  status: VersionStatus;
  authorId: number;
  contentHash: string | null;
  withdrawnReason: string | null;
  definitionText: string;
}

interface Row {
  id: number; slug: string; title: string; version: number; status: VersionStatus; author_id: number; content_hash: string | null;
  withdrawn_reason: string | null; definition: string;
}
const COLUMNS = 'v.id, c.slug, c.title, v.version, v.status, v.author_id, v.content_hash, v.withdrawn_reason, v.definition';
const toServable = (r: Row): ServableVersion => ({
  id: r.id, slug: r.slug, title: r.title, version: r.version, status: r.status, authorId: r.author_id, contentHash: r.content_hash,
  withdrawnReason: r.withdrawn_reason, definitionText: r.definition,
});

const NOUN: Record<EntryKind, string> = { correlation: 'correlation', template: 'calculation template' };

/**
 * Frozen versions looked up by slug (and number, or "approved"), at most FRESHNESS_MS old (lib/cache/fresh.ts): a
 * withdrawal or a new approval reaches every instance within that bound, the instance that made it at once
 * (`forgetServableVersions`). The integrity check still re-hashes what the database held when the entry was read.
 */
const FROZEN: VersionStatus[] = ['approved', 'superseded', 'withdrawn'];
interface Lookup { slug: string; kind: EntryKind; version?: number }
const servableCache = freshLoader<ServableVersion | { none: true }, Lookup>(async (_key, { slug, kind, version }) => {
  const [row] = await db().sequelize.query<Row>(`SELECT ${COLUMNS}
      FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id
      WHERE c.slug = ? AND c.kind = ? AND ${version !== undefined ? 'v.version = ?' : "v.status = 'approved'"} LIMIT 1`,
  { replacements: version !== undefined ? [slug, kind, version] : [slug, kind], type: QueryTypes.SELECT });
  return row ? toServable(row) : { none: true };
}, 5_000);
export function forgetServableVersions() {
  servableCache.clear();
}

/**
 * The version to evaluate: an explicit number, or the approved one, of a correlation or (kind
 * "template") a calculation template. Visibility rules apply; a withdrawn version is found only when
 * pinned (it is never "approved").
 */
export async function loadServableVersion({ actor, slug, version, kind = 'correlation' }: { actor: AuthUser; slug: string; version?: number; kind?: EntryKind }): Promise<ServableVersion> {
  const key = `${kind}|${slug}|${version ?? 'approved'}`;
  const entry = (await servableCache.fetch(key, { context: { slug, kind, version } }))!;
  const found = 'none' in entry ? undefined : entry;
  // Only frozen versions are remembered: a draft changes under its author's hands, and a miss may be created.
  if (!found || !FROZEN.includes(found.status)) servableCache.delete(key);
  if (!found || !canSeeVersion(actor, found)) {
    const { Correlation } = db();
    if (!(await Correlation.findOne({ where: { slug, kind }, attributes: ['id'] }))) throw new AppError(`not_found:${kind}`, `No ${NOUN[kind]} "${slug}".`);
    throw version !== undefined
      ? new AppError('not_found:version', `The ${NOUN[kind]} "${slug}" has no version ${version} you can use.`)
      : new AppError('not_found:approved-version', `The ${NOUN[kind]} "${slug}" has no approved version; pin a version explicitly.`);
  }
  return found;
}

/** The correlation versions a template pins, in one query (missing ones are simply absent). */
export async function loadPinnedVersions(pins: Pin[], transaction?: import('sequelize').Transaction): Promise<Map<string, ServableVersion>> {
  if (pins.length === 0) return new Map();
  const { sequelize } = db();
  const rows = await sequelize.query<Row>(`SELECT ${COLUMNS}
      FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id
      WHERE c.kind = 'correlation' AND (${pins.map(() => '(c.slug = ? AND v.version = ?)').join(' OR ')})`,
  { replacements: pins.flatMap((p) => [p.slug, p.version]), type: QueryTypes.SELECT, transaction });
  return new Map(rows.map((r) => [`${r.slug}@${r.version}`, toServable(r)]));
}
