import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import { db, type CorrelationVersion, type EntryKind, type VersionStatus } from '@/models';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { userLabels } from '@/lib/auth/labels';
import type { Definition } from '@/lib/engine/types';
import { canSeeVersion, PUBLISHED } from './access';
import { definitionTex, validitySummary } from './serialize';
import { frozenContentOf, verifyFrozen } from './integrity';
import { checkCasesOfVersion } from './check-cases';

export { checkCasesOfVersion };

export interface ListQuery {
  q?: string;
  category?: string;
  status?: VersionStatus | 'any';
  situation?: string;
  grade?: 'well-founded' | 'adequate' | 'thin';
  sort?: 'title' | 'category' | 'updated' | 'slug';
  dir?: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

/**
 * A search word as a full-text term: each of its letter-and-digit runs must start a word of the definition
 * ("re_d" → +re_d*, "k-epsilon" → +k* +epsilon*). Runs shorter than the index's smallest word (3 by default) are
 * left to the title, slug and tag match. Boolean-mode operators cannot pass: only letters, digits and _ remain.
 */
function fullTextTerm(word: string): string | null {
  const runs = word.split(/[^\p{L}\p{N}_]+/u).filter((r) => r.length >= 3);
  return runs.length ? runs.map((r) => `+${r}*`).join(' ') : null;
}

const SORT_COLUMN: Record<NonNullable<ListQuery['sort']>, string> = { title: 'c.title', category: 'c.category', updated: 'c.updated_at', slug: 'c.slug' };

/**
 * The library list. One SQL query with the latest approved version and the newest version the
 * caller may see, filtered, sorted and paged in the database (fast with thousands of entries).
 */
export async function listCorrelations({ actor, query, kind = 'correlation' }: { actor: AuthUser | null; query: ListQuery; kind?: EntryKind }) {
  const { sequelize } = db();
  const isApprover = actor?.roles.includes('approver') ?? false;
  const visible = `(v.status IN ('approved','superseded','withdrawn') OR v.author_id = :me OR :approver = 1)`;
  const where: string[] = ['c.kind = :kind', `EXISTS (SELECT 1 FROM correlation_versions v WHERE v.correlation_id = c.id AND ${visible})`];
  const repl: Record<string, unknown> = { me: actor?.id ?? 0, approver: isApprover ? 1 : 0, kind };
  if (query.q) {
    // Every word must appear somewhere: anywhere in the title, slug, situation or tags, or as the start of a word of
    // the approved definition (input and output names, references, notes), found through its full-text index
    // (migrations/20261204000100): "laminar flat plate average" and "reynolds" find what an engineer means.
    const words = query.q.toLowerCase().split(/\s+/).filter(Boolean).slice(0, 8);
    words.forEach((w, i) => {
      const inDefinition = fullTextTerm(w);
      where.push(`(c.title LIKE :q${i} OR c.slug LIKE :q${i} OR c.situation LIKE :q${i} OR c.tags LIKE :q${i}${inDefinition ? `
        OR c.id IN (SELECT s.correlation_id FROM correlation_versions s WHERE s.status = 'approved' AND MATCH (s.definition) AGAINST (:ft${i} IN BOOLEAN MODE))` : ''})`);
      repl[`q${i}`] = `%${w.replace(/[%_\\]/g, (m) => `\\${m}`)}%`;
      if (inDefinition) repl[`ft${i}`] = inDefinition;
    });
  }
  if (query.category) { where.push('c.category = :category'); repl.category = query.category; }
  if (query.situation) { where.push('c.situation = :situation'); repl.situation = query.situation; }
  if (query.grade) {
    where.push("EXISTS (SELECT 1 FROM correlation_versions g WHERE g.correlation_id = c.id AND g.status = 'approved' AND g.evidence_grade = :grade)");
    repl.grade = query.grade;
  }
  if (query.status && query.status !== 'any') {
    where.push(`EXISTS (SELECT 1 FROM correlation_versions v WHERE v.correlation_id = c.id AND v.status = :status AND ${visible})`);
    repl.status = query.status;
  }
  const whereSql = where.join(' AND ');
  const order = `${SORT_COLUMN[query.sort ?? 'title']} ${query.dir === 'desc' ? 'DESC' : 'ASC'}, c.id ASC`;
  // The count and the page side by side (a window count would make the database build every row, not one page).
  const counted = sequelize.query<{ total: number }>(`SELECT COUNT(*) AS total FROM correlations c WHERE ${whereSql}`, { replacements: repl, type: QueryTypes.SELECT });
  const listed = sequelize.query<{
    id: number; slug: string; title: string; category: string; situation: string; tags: string; updated_at: Date;
    approved_version: number | null; approved_definition: string | null; approved_at: Date | null; approved_hash: string | null; approved_grade: string | null; latest_version: number; latest_status: VersionStatus;
  }>(`
    SELECT c.id, c.slug, c.title, c.category, c.situation, c.tags, c.updated_at,
      a.version AS approved_version, a.definition AS approved_definition, a.approved_at, a.content_hash AS approved_hash, a.evidence_grade AS approved_grade,
      l.version AS latest_version, l.status AS latest_status
    FROM correlations c
    LEFT JOIN correlation_versions a ON a.correlation_id = c.id AND a.status = 'approved'
    LEFT JOIN correlation_versions l ON l.id = (
      SELECT v.id FROM correlation_versions v WHERE v.correlation_id = c.id AND ${visible} ORDER BY v.version DESC LIMIT 1)
    WHERE ${whereSql}
    ORDER BY ${order}
    LIMIT :limit OFFSET :offset`, {
    replacements: { ...repl, limit: query.pageSize, offset: (query.page - 1) * query.pageSize }, type: QueryTypes.SELECT,
  });
  const [[{ total }], rows] = await Promise.all([counted, listed]);
  return {
    items: rows.map((r) => ({
      slug: r.slug, title: r.title, category: r.category, situation: r.situation, tags: JSON.parse(r.tags ?? '[]') as string[],
      latestApprovedVersion: r.approved_version ?? null,
      approvedAt: r.approved_at ?? null,
      approvedContentHash: r.approved_hash ?? null,
      evidenceGrade: r.approved_grade ?? null,
      latestVersion: r.latest_version, latestStatus: r.latest_status,
      validity: r.approved_definition && kind === 'correlation' ? validitySummary(JSON.parse(r.approved_definition) as Definition) : '',
      updatedAt: r.updated_at,
    })),
    total: Number(total), page: query.page, pageSize: query.pageSize,
  };
}

export async function findCorrelation(slug: string) {
  const { Correlation } = db();
  const c = await Correlation.findOne({ where: { slug } });
  if (!c) throw new AppError('not_found:correlation', `No correlation "${slug}".`);
  return c;
}

/** A correlation with the versions the caller may see. */
export async function getCorrelation({ actor, slug }: { actor: AuthUser | null; slug: string }) {
  const { CorrelationVersion } = db();
  const c = await findCorrelation(slug);
  const versions = (await CorrelationVersion.findAll({ where: { correlationId: c.id }, order: [['version', 'DESC']] })).filter((v) => canSeeVersion(actor, v));
  if (versions.length === 0) throw new AppError('not_found:correlation', `No correlation "${slug}".`);
  const users = await userLabels({ ids: versions.map((v) => v.authorId) });
  const approved = versions.find((v) => v.status === 'approved');
  return {
    slug: c.slug, kind: c.kind, title: c.title, category: c.category, situation: c.situation, tags: c.tags,
    latestApprovedVersion: approved?.version ?? null,
    versions: versions.map((v) => ({
      version: v.version, status: v.status, contentHash: v.contentHash, evidenceGrade: v.evidenceGrade ?? null, author: users.get(v.authorId) ?? '?', authorId: v.authorId,
      createdAt: v.createdAt, submittedAt: v.submittedAt, ...(v.approvedAt ? { approvedAt: v.approvedAt } : {}),
      ...(v.withdrawnAt ? { withdrawnAt: v.withdrawnAt, withdrawnReason: v.withdrawnReason } : {}),
    })),
  };
}

/** Resolves which version to use: an explicit number, or the approved one. Visibility applies. */
export async function resolveVersion({ actor, slug, version }: { actor: AuthUser | null; slug: string; version?: number }) {
  const { Correlation, CorrelationVersion } = db();
  // One query on the hot path: the version with its correlation, found by slug.
  const where: WhereOptions = version !== undefined ? { version } : { status: 'approved' };
  const v = await CorrelationVersion.findOne({ where, include: [{ model: Correlation, as: 'correlation', where: { slug }, required: true }] });
  const c = v?.correlation ?? (await findCorrelation(slug));
  if (!v || !canSeeVersion(actor, v)) {
    throw version !== undefined
      ? new AppError('not_found:version', `Correlation "${slug}" has no version ${version} you can use.`)
      : new AppError('not_found:approved-version', `Correlation "${slug}" has no approved version; pin a version explicitly.`);
  }
  return { correlation: c, version: v };
}


/** Everything a version page and the API's version answer show. Frozen versions are integrity-checked. */
export async function getVersionDetail({ actor, slug, version }: { actor: AuthUser | null; slug: string; version: number }) {
  const { SignOff, VersionComment, ValidationRun } = db();
  const { correlation, version: v } = await resolveVersion({ actor, slug, version });
  await verifyFrozen(frozenContentOf(v), slug);
  const checkCases = await checkCasesOfVersion(v.id);
  const [signOffs, comments, run] = await Promise.all([
    SignOff.findAll({ where: { versionId: v.id }, order: [['id', 'ASC']] }),
    VersionComment.findAll({ where: { versionId: v.id }, order: [['id', 'ASC']] }),
    ValidationRun.findOne({ where: { versionId: v.id }, order: [['id', 'DESC']] }),
  ]);
  const ids = [...new Set([v.authorId, ...signOffs.map((s) => s.userId), ...comments.map((c) => c.userId)])];
  const names = await userLabels({ ids });
  const definition = v.definition as Definition;
  return {
    slug, kind: correlation.kind, title: correlation.title, version: v.version, status: v.status, contentHash: v.contentHash,
    frozen: v.status !== 'draft', author: names.get(v.authorId) ?? '?', authorId: v.authorId,
    createdAt: v.createdAt, submittedAt: v.submittedAt, approvedAt: v.approvedAt, withdrawnAt: v.withdrawnAt, withdrawnReason: v.withdrawnReason,
    definition, checkCases,
    validation: run ? (run.report as object) : null,
    evidence: run ? ((run.report as { evidence?: object }).evidence ?? null) : null,
    tex: safeTex(definition, v.contentHash),
    signOffs: signOffs.map((s) => ({ decision: s.decision, by: names.get(s.userId) ?? '?', at: s.createdAt, comment: s.comment, meaning: s.meaning, contentHash: s.contentHash, ...(s.waiver ? { waiver: s.waiver } : {}) })),
    comments: comments.map((c) => ({ by: names.get(c.userId) ?? '?', at: c.createdAt, body: c.body })),
  };
}

const texByHash = new Map<string, Record<string, string>>();

/** TeX of a definition's equations; a frozen version's is computed once per content hash. */
function safeTex(definition: Definition, hash: string | null): Record<string, string> {
  const cached = hash ? texByHash.get(hash) : undefined;
  if (cached) return cached;
  let tex: Record<string, string> = {};
  try {
    tex = definitionTex(definition);
  } catch {
    // An invalid draft has no typeset equations; its validation report says why.
  }
  if (hash) {
    if (texByHash.size > 500) texByHash.clear();
    texByHash.set(hash, tex);
  }
  return tex;
}

/** The previously approved (or superseded) version before `version`, for review diffs. */
export async function previousApproved({ slug, before }: { slug: string; before: number }): Promise<CorrelationVersion | null> {
  const { CorrelationVersion } = db();
  const c = await findCorrelation(slug);
  return CorrelationVersion.findOne({
    where: { correlationId: c.id, version: { [Op.lt]: before }, status: { [Op.in]: ['approved', 'superseded', 'withdrawn'] } },
    order: [['version', 'DESC']],
  });
}

/** Versions waiting for review, oldest first, for approvers. */
export async function reviewQueue({ actor }: { actor: AuthUser }) {
  const { CorrelationVersion, Correlation } = db();
  const rows = await CorrelationVersion.findAll({ where: { status: 'in_review' }, include: [{ model: Correlation, as: 'correlation' }], order: [['submittedAt', 'ASC']] });
  const names = await userLabels({ ids: rows.map((v) => v.authorId) });
  return rows.map((v) => ({
    slug: v.correlation!.slug, title: v.correlation!.title, version: v.version, author: names.get(v.authorId) ?? '?',
    submittedAt: v.submittedAt, contentHash: v.contentHash, ownVersion: v.authorId === actor.id,
  }));
}

/** The author's own drafts and returned versions. */
export async function authorWork({ actor }: { actor: AuthUser }) {
  const { CorrelationVersion, Correlation } = db();
  const rows = await CorrelationVersion.findAll({
    where: { authorId: actor.id, status: { [Op.in]: ['draft', 'in_review', 'returned'] } },
    include: [{ model: Correlation, as: 'correlation' }], order: [['updatedAt', 'DESC']],
  });
  // A returned version carries the reviewer's comment, and the author's newer draft of it if one is open.
  const returned = rows.filter((v) => v.status === 'returned');
  const { SignOff } = db();
  const signOffs = returned.length ? await SignOff.findAll({ where: { versionId: returned.map((v) => v.id), decision: 'returned' }, order: [['id', 'DESC']] }) : [];
  const names = await userLabels({ ids: signOffs.map((s) => s.userId) });
  return rows.map((v) => {
    const s = v.status === 'returned' ? signOffs.find((x) => x.versionId === v.id) : undefined;
    const newer = v.status === 'returned' ? rows.find((x) => x.correlationId === v.correlationId && x.status === 'draft' && x.version > v.version) : undefined;
    return {
      slug: v.correlation!.slug, title: v.correlation!.title, version: v.version, status: v.status, updatedAt: v.updatedAt,
      ...(s ? { returnedBy: names.get(s.userId) ?? '?', returnComment: s.comment } : {}),
      ...(newer ? { nextDraft: newer.version } : {}),
    };
  });
}

export { PUBLISHED };
