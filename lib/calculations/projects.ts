import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { db, type Project, type ProjectRole } from '@/models';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { userLabels } from '@/lib/auth/labels';
import { appendAuditEvent } from '@/lib/audit/log';

/**
 * Projects group calculations. Who may do what, in one place:
 * - read: the owner, members (editors and reviewers), approvers and admins;
 * - edit (save calculations and revisions): the owner and editors;
 * - manage members: the owner and admins.
 */
export interface ProjectAccess { read: boolean; edit: boolean; manage: boolean }

export async function projectAccess(actor: AuthUser, project: Pick<Project, 'id' | 'ownerId'>): Promise<ProjectAccess> {
  const { ProjectMember } = db();
  const owner = project.ownerId === actor.id;
  const admin = actor.roles.includes('admin');
  const member = owner ? null : await ProjectMember.findOne({ where: { projectId: project.id, userId: actor.id } });
  const edit = owner || member?.role === 'editor';
  return { read: edit || Boolean(member) || admin || actor.roles.includes('approver'), edit, manage: owner || admin };
}

/** The project if the actor may read it (else "not found": its existence is not revealed). */
export async function projectFor(actor: AuthUser, id: number, need: keyof ProjectAccess = 'read') {
  const { Project } = db();
  const p = await Project.findByPk(id);
  const access = p ? await projectAccess(actor, p) : null;
  if (!p || !access?.read) throw new AppError('not_found:project', `No project ${id} you can see.`);
  if (!access[need]) {
    throw new AppError(`forbidden:project-${need}`, need === 'edit' ? 'Only the project owner and its editors can save calculations here.' : 'Only the project owner or an admin can change its members.');
  }
  return { project: p, access };
}

export async function createProject({ actor, name, description }: { actor: AuthUser; name: string; description: string }) {
  if (!actor.roles.includes('engineer')) throw new AppError('forbidden:role', 'Creating a project needs the engineer role.');
  const { sequelize, Project } = db();
  return sequelize.transaction(async (transaction) => {
    const p = await Project.create({ name: name.trim(), description: description.trim(), ownerId: actor.id }, { transaction });
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'project.created', entityType: 'project', entityId: String(p.id), details: { name: p.name } } });
    return { id: p.id, name: p.name };
  });
}

export async function setProjectMember({ actor, projectId, email, role }: { actor: AuthUser; projectId: number; email: string; role: ProjectRole | null }) {
  const { project } = await projectFor(actor, projectId, 'manage');
  const { sequelize, User, ProjectMember } = db();
  const user = await User.findOne({ where: { email: email.trim().toLowerCase(), isActive: true } });
  if (!user) throw new AppError('invalid:member', `No active user with the e-mail ${email}.`, { issues: [{ path: 'email', message: 'No active user with this e-mail' }] });
  if (user.id === project.ownerId) throw new AppError('invalid:member', 'The owner is always a member.', { issues: [{ path: 'email', message: 'This is the project owner' }] });
  await sequelize.transaction(async (transaction) => {
    if (role) await ProjectMember.upsert({ projectId, userId: user.id, role }, { transaction });
    else await ProjectMember.destroy({ where: { projectId, userId: user.id }, transaction });
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: role ? 'project.member-set' : 'project.member-removed', entityType: 'project', entityId: String(projectId), details: { userId: user.id, role } } });
  });
  return { projectId, userId: user.id, role };
}

/** Calculation ids of a project's latest revisions that use a withdrawn version, with what they use. */
export async function flaggedCalculations(calculationIds: number[]): Promise<Map<number, { slug: string; version: number; reason: string | null }[]>> {
  const out = new Map<number, { slug: string; version: number; reason: string | null }[]>();
  if (calculationIds.length === 0) return out;
  const { sequelize } = db();
  const rows = await sequelize.query<{ calculation_id: number; slug: string; version: number; reason: string | null }>(`
    SELECT r.calculation_id, c.slug, v.version, v.withdrawn_reason AS reason
    FROM calculations k
    JOIN calculation_revisions r ON r.calculation_id = k.id AND r.revision = k.latest_revision
    JOIN calculation_uses u ON u.revision_id = r.id
    JOIN correlation_versions v ON v.id = u.version_id AND v.status = 'withdrawn'
    JOIN correlations c ON c.id = v.correlation_id
    WHERE k.id IN (:ids)`, { replacements: { ids: calculationIds }, type: QueryTypes.SELECT });
  for (const r of rows) out.set(r.calculation_id, [...(out.get(r.calculation_id) ?? []), { slug: r.slug, version: r.version, reason: r.reason }]);
  return out;
}

/** Projects the actor may read, with their calculation and flag counts. */
export async function listProjects({ actor }: { actor: AuthUser }) {
  const { Project, ProjectMember, Calculation } = db();
  const wide = actor.roles.includes('admin') || actor.roles.includes('approver');
  const memberships = await ProjectMember.findAll({ where: { userId: actor.id } });
  const memberOf = memberships.map((m) => m.projectId);
  const projects = await Project.findAll({ where: wide ? {} : { [Op.or]: [{ ownerId: actor.id }, { id: memberOf }] }, order: [['updatedAt', 'DESC']], limit: 200 });
  const calcs = projects.length ? await Calculation.findAll({ where: { projectId: projects.map((p) => p.id) }, attributes: ['id', 'projectId'] }) : [];
  const flags = await flaggedCalculations(calcs.map((c) => c.id));
  const owners = await userLabels({ ids: projects.map((p) => p.ownerId) });
  return projects.map((p) => {
    const mine = calcs.filter((c) => c.projectId === p.id);
    const canEdit = p.ownerId === actor.id || memberships.some((m) => m.projectId === p.id && m.role === 'editor');
    return { id: p.id, name: p.name, description: p.description, owner: owners.get(p.ownerId) ?? '?', canEdit, calculations: mine.length, flagged: mine.filter((c) => flags.has(c.id)).length, updatedAt: p.updatedAt };
  });
}

/** A project with its members and calculations (latest revision, flags). */
export async function getProject({ actor, id }: { actor: AuthUser; id: number }) {
  const { project, access } = await projectFor(actor, id);
  const { ProjectMember, Calculation, CalculationRevision } = db();
  const [members, calcs] = await Promise.all([
    ProjectMember.findAll({ where: { projectId: id } }),
    Calculation.findAll({ where: { projectId: id }, order: [['updatedAt', 'DESC']] }),
  ]);
  const latest = calcs.length ? await CalculationRevision.findAll({ where: { [Op.or]: calcs.map((c) => ({ calculationId: c.id, revision: c.latestRevision })) }, attributes: ['calculationId', 'content', 'createdAt'] }) : [];
  const flags = await flaggedCalculations(calcs.map((c) => c.id));
  const names = await userLabels({ ids: [project.ownerId, ...members.map((m) => m.userId), ...calcs.map((c) => c.ownerId)] });
  return {
    id: project.id, name: project.name, description: project.description, owner: names.get(project.ownerId) ?? '?', access,
    members: members.map((m) => ({ userId: m.userId, name: names.get(m.userId) ?? '?', role: m.role })),
    calculations: calcs.map((c) => {
      const rev = latest.find((r) => r.calculationId === c.id);
      const content = rev?.content as { template?: { slug: string; version: number; title: string } | null; rows?: unknown } | undefined;
      return {
        id: c.id, title: c.title, revision: c.latestRevision, owner: names.get(c.ownerId) ?? '?', updatedAt: c.updatedAt,
        template: content?.template ?? null, parametric: Boolean(content?.rows), flags: flags.get(c.id) ?? [],
      };
    }),
  };
}
