import type { Transaction } from 'sequelize';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { flushUsage } from '@/lib/api/usage';

/** Everything that used a version: saved calculations, templates that pin it, evaluations by person. */
export interface VersionUses {
  calculations: { id: number; title: string; projectId: number; project: string; ownerId: number; savedBy: number[] }[];
  templates: { slug: string; title: string; version: number; status: string; authorId: number }[];
  evaluations: { userId: number; name: string; evaluations: number; viaToken: boolean }[];
}

/**
 * "What uses this version": the approver sees it before withdrawing, and withdrawal mails every
 * person in it. Usage counts are flushed first so the last second of evaluations is included.
 */
export async function usesOfVersion(versionId: number, transaction?: Transaction): Promise<VersionUses> {
  await flushUsage();
  const { sequelize } = db();
  const calcs = await sequelize.query<{ id: number; title: string; project_id: number; project: string; owner_id: number; created_by: number }>(`
    SELECT k.id, k.title, k.project_id, p.name AS project, k.owner_id, r.created_by
    FROM calculation_uses u JOIN calculation_revisions r ON r.id = u.revision_id JOIN calculations k ON k.id = r.calculation_id
    JOIN projects p ON p.id = k.project_id WHERE u.version_id = ? ORDER BY k.id`, { replacements: [versionId], type: QueryTypes.SELECT, transaction });
  const calculations = new Map<number, VersionUses['calculations'][number]>();
  for (const c of calcs) {
    const entry = calculations.get(c.id) ?? { id: c.id, title: c.title, projectId: c.project_id, project: c.project, ownerId: c.owner_id, savedBy: [] };
    if (!entry.savedBy.includes(c.created_by)) entry.savedBy.push(c.created_by);
    calculations.set(c.id, entry);
  }
  const templates = await sequelize.query<{ slug: string; title: string; version: number; status: string; author_id: number }>(`
    SELECT c.slug, c.title, v.version, v.status, v.author_id FROM template_dependencies d
    JOIN correlation_versions v ON v.id = d.template_version_id JOIN correlations c ON c.id = v.correlation_id
    WHERE d.version_id = ? ORDER BY c.slug, v.version`, { replacements: [versionId], type: QueryTypes.SELECT, transaction });
  const evaluations = await sequelize.query<{ user_id: number; name: string; evaluations: number; via_token: number }>(`
    SELECT u.user_id, us.name, SUM(u.evaluations) AS evaluations, MAX(u.token_id > 0) AS via_token
    FROM usage_records u JOIN users us ON us.id = u.user_id WHERE u.version_id = ? GROUP BY u.user_id, us.name ORDER BY us.name`,
  { replacements: [versionId], type: QueryTypes.SELECT, transaction });
  return {
    calculations: [...calculations.values()],
    templates: templates.map((t) => ({ slug: t.slug, title: t.title, version: t.version, status: t.status, authorId: t.author_id })),
    evaluations: evaluations.map((e) => ({ userId: e.user_id, name: e.name, evaluations: Number(e.evaluations), viaToken: Boolean(Number(e.via_token)) })),
  };
}

/** Who is told when the version is withdrawn: calculation owners and savers, template authors, evaluators. */
export function peopleToTell(uses: VersionUses): number[] {
  return [...new Set([
    ...uses.calculations.flatMap((c) => [c.ownerId, ...c.savedBy]),
    ...uses.templates.filter((t) => t.status === 'approved' || t.status === 'in_review' || t.status === 'draft').map((t) => t.authorId),
    ...uses.evaluations.map((e) => e.userId),
  ])];
}
