import { assertAttachmentRefs } from '@/lib/evidence/attachments';
import { Op, type Transaction } from 'sequelize';
import { db, type CorrelationVersion, type Correlation } from '@/models';
import { AppError } from '@/lib/http/errors';
import { appendAuditEvent } from '@/lib/audit/log';
import { enqueueMail, deliverPendingMail, isMailDeferred, type MailMessage } from '@/lib/mail/outbox';
import { enqueueVersionEvent } from '@/lib/webhooks/service';
import { forgetServableVersions } from './servable';
import { usersWithRole, findUserById, type AuthUser } from '@/lib/auth/users';
import { verifyPassword } from '@/lib/auth/passwords';
import { personBuckets, throttledCheck } from '@/lib/auth/throttle';
import { validateVersion, type ValidationReport } from '@/lib/engine/validate';
import { checkCheckCaseSchema, checkDefinitionSchema, checkTemplateSchema } from '@/lib/engine/schema';
import { validateTemplate } from '@/lib/engine/validate';
import { isTemplateDefinition, pinsOf, type TemplateDefinition } from '@/lib/engine/template-types';
import { resolvePins } from '@/lib/evaluation/verified';
import type { EntryKind } from '@/models';
import { contentHash } from '@/lib/engine/canonical';
import type { CheckCase, Definition } from '@/lib/engine/types';
import { MEANING_OF_APPROVAL, MEANING_OF_RETURN, MEANING_OF_WITHDRAWAL } from './access';
import { assertIntact } from './integrity';
import { usesOfVersion, peopleToTell } from './uses';
import { checkCasesOfVersion } from './check-cases';
import { loadPinnedVersions } from './servable';
import { evidencePolicy } from './policy';
import { meetsPolicy } from '@/lib/engine/evidence';
import { PUBLISHED } from './access';

export const SLUG_PATTERN = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

const appUrl = () => process.env.NEXTAUTH_URL ?? 'http://localhost:3000';

function requireRole(actor: AuthUser, role: 'author' | 'approver') {
  if (!actor.roles.includes(role)) throw new AppError('forbidden:role', `This needs the ${role} role.`);
}

async function lockedCorrelation(slug: string, transaction: Transaction): Promise<Correlation> {
  const { Correlation } = db();
  const c = await Correlation.findOne({ where: { slug }, transaction, lock: transaction.LOCK.UPDATE });
  if (!c) throw new AppError('not_found:correlation', `No correlation "${slug}".`);
  return c;
}

async function lockedVersion(correlationId: number, slug: string, version: number, transaction: Transaction): Promise<CorrelationVersion> {
  const { CorrelationVersion } = db();
  const v = await CorrelationVersion.findOne({ where: { correlationId, version }, transaction, lock: transaction.LOCK.UPDATE });
  if (!v) throw new AppError('not_found:version', `Correlation "${slug}" has no version ${version}.`);
  return v;
}

async function replaceCheckCases(versionId: number, cases: CheckCase[], transaction: Transaction) {
  const { CheckCaseRow } = db();
  await CheckCaseRow.destroy({ where: { versionId }, transaction });
  if (cases.length) {
    await CheckCaseRow.bulkCreate(cases.map((c, i) => ({ versionId, position: i, label: String(c.label ?? `case ${i + 1}`).slice(0, 200), body: c })), { transaction });
  }
}

/** After a committed change, send what it queued; mail trouble never undoes the change. */
async function flushMail() {
  if (isMailDeferred()) return;
  try {
    await deliverPendingMail();
  } catch (err) {
    console.error('mail delivery failed', err);
  }
}

function versionLink(slug: string, version: number) {
  return `${appUrl()}/correlations/${slug}/versions/${version}`;
}

/** A draft may still fail its check cases, but its definition and check cases must fit their schemas. */
function assertSchemaValid(definition: unknown, checkCases: unknown[] | undefined, kind: EntryKind) {
  const schema = kind === 'template' ? checkTemplateSchema : checkDefinitionSchema;
  const issues = [
    ...(definition === undefined ? [] : schema(definition).map((i) => ({ path: `definition${i.pointer === '/' ? '' : i.pointer}`, message: i.message }))),
    ...(checkCases ?? []).flatMap((cc, n) => checkCheckCaseSchema(cc).map((i) => ({ path: `checkCases/${n}${i.pointer === '/' ? '' : i.pointer}`, message: i.message }))),
  ];
  if (issues.length) {
    const list = issues.slice(0, 3).map((i) => `${i.path}: ${i.message}`).join('; ');
    throw new AppError('invalid:definition', `Not saved: ${issues.length} schema problem${issues.length === 1 ? '' : 's'} — ${list}${issues.length > 3 ? '; …' : ''}`, { issues });
  }
}

const kindOf = (definition: unknown): EntryKind => (isTemplateDefinition(definition) ? 'template' : 'correlation');

/**
 * The full validation of a version's content by its kind. A template's pinned correlation versions
 * are loaded and integrity-checked first; each must exist, be approved and match its hash.
 */
export async function validateContent({ kind, definition, checkCases, transaction }: { kind: EntryKind; definition: unknown; checkCases: unknown[]; transaction?: Transaction }): Promise<ValidationReport> {
  if (kind === 'correlation') return validateVersion(definition, checkCases, await evidencePolicy());
  const pins = checkTemplateSchema(definition).length ? [] : pinsOf(definition as TemplateDefinition);
  const { resolve } = await resolvePins(pins, { forApproval: true, transaction });
  return validateTemplate(definition, checkCases, resolve);
}

export interface DraftContent {
  definition: unknown;
  checkCases: unknown[];
}

function correlationMeta(definition: unknown) {
  const d = (definition ?? {}) as Partial<Definition>;
  return {
    title: typeof d.title === 'string' && d.title.trim() ? d.title.slice(0, 200) : 'Untitled correlation',
    category: typeof d.category === 'string' ? d.category.slice(0, 40) : 'external-flow',
    situation: typeof d.situation === 'string' ? d.situation.slice(0, 120) : '',
    tags: Array.isArray(d.tags) ? d.tags.filter((t) => typeof t === 'string').slice(0, 20) : [],
  };
}

/** A new correlation with its first draft. The slug is its stable, public identifier. */
export async function createCorrelation({ actor, slug, definition, checkCases }: { actor: AuthUser; slug: string } & DraftContent) {
  requireRole(actor, 'author');
  const kind = kindOf(definition);
  if (!SLUG_PATTERN.test(slug) || slug.length > 100) {
    throw new AppError('invalid:slug', 'The slug must be lower-case words joined by hyphens, e.g. "cylinder-crossflow-hilpert".', { issues: [{ path: 'slug', message: 'lower-case letters, digits and hyphens only' }] });
  }
  assertSchemaValid(definition, checkCases, kind);
  await assertAttachmentRefs(actor, checkCases);
  const { sequelize, Correlation, CorrelationVersion } = db();
  return sequelize.transaction(async (transaction) => {
    if (await Correlation.findOne({ where: { slug }, transaction })) {
      throw new AppError('conflict:slug', `A correlation with the slug "${slug}" already exists.`, { issues: [{ path: 'slug', message: 'already in use' }] });
    }
    const meta = correlationMeta(definition);
    const c = await Correlation.create({ slug, kind, ownerId: actor.id, ...meta }, { transaction });
    const v = await CorrelationVersion.create({
      correlationId: c.id, version: 1, status: 'draft', definition, contentHash: null, authorId: actor.id,
      submittedAt: null, approvedAt: null, approvedById: null, returnedAt: null, supersededAt: null, withdrawnAt: null, withdrawnReason: null,
    }, { transaction });
    await replaceCheckCases(v.id, checkCases as CheckCase[], transaction);
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'correlation.created', entityType: 'correlation', entityId: slug, details: { version: 1, kind } } });
    return { slug, version: 1 };
  });
}

/** A new draft, copied from `fromVersion` or else the newest version. Numbers are allocated under a row lock. */
export async function createDraftVersion({ actor, slug, fromVersion }: { actor: AuthUser; slug: string; fromVersion?: number }) {
  requireRole(actor, 'author');
  const { sequelize, CorrelationVersion } = db();
  return sequelize.transaction(async (transaction) => {
    const c = await lockedCorrelation(slug, transaction);
    const versions = await CorrelationVersion.findAll({ where: { correlationId: c.id }, order: [['version', 'DESC']], transaction });
    // Unpublished work (drafts, versions in review, returned ones) is its owner's: only they, the
    // correlation's owner or an admin may copy it; anyone else starts from a published version.
    const mayCopy = (v: CorrelationVersion) => PUBLISHED.includes(v.status) || v.authorId === actor.id || c.ownerId === actor.id || actor.roles.includes('admin');
    const source = fromVersion ? versions.find((v) => v.version === fromVersion) : versions.find(mayCopy);
    if (!source) throw new AppError('not_found:version', fromVersion ? `Correlation "${slug}" has no version ${fromVersion}.` : `Correlation "${slug}" has no published version to start from.`);
    if (!mayCopy(source)) throw new AppError('forbidden:unpublished-version', `Version ${source.version} of "${slug}" is not published; only its author or the correlation's owner may start a new version from it.`);
    const openDraft = versions.find((v) => v.status === 'draft' && v.authorId === actor.id);
    if (openDraft) throw new AppError('conflict:open-draft', `You already have a draft of "${slug}" (version ${openDraft.version}); edit or submit it first.`);
    const number = (versions[0]?.version ?? 0) + 1;
    const v = await CorrelationVersion.create({
      correlationId: c.id, version: number, status: 'draft', definition: source.definition, contentHash: null, authorId: actor.id,
      submittedAt: null, approvedAt: null, approvedById: null, returnedAt: null, supersededAt: null, withdrawnAt: null, withdrawnReason: null,
    }, { transaction });
    await replaceCheckCases(v.id, await checkCasesOfVersion(source.id, transaction), transaction);
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'version.drafted', entityType: 'version', entityId: `${slug}@${number}`, details: { from: source.version } } });
    return { slug, version: number };
  });
}

/** Saves a draft's definition and/or check cases. Only the author, only while it is a draft. */
export async function updateDraft({ actor, slug, version, definition, checkCases }: { actor: AuthUser; slug: string; version: number } & Partial<DraftContent>) {
  const { sequelize, Correlation } = db();
  const result = await sequelize.transaction(async (transaction) => {
    const c = await lockedCorrelation(slug, transaction);
    const v = await lockedVersion(c.id, slug, version, transaction);
    if (v.authorId !== actor.id) throw new AppError('forbidden:not-author', 'Only the author of a draft can change it.');
    if (v.status !== 'draft') throw new AppError('conflict:frozen', `Version ${version} is ${v.status.replace('_', ' ')} and can no longer change; start a new version.`);
    if (definition !== undefined && kindOf(definition) !== c.kind) {
      throw new AppError('invalid:definition', `"${slug}" is a ${c.kind === 'template' ? 'calculation template' : 'correlation'}; a new version must stay one.`, { issues: [{ path: 'definition/kind', message: c.kind === 'template' ? 'must be "template"' : 'a correlation definition has no "kind"' }] });
    }
    assertSchemaValid(definition, checkCases, c.kind);
    if (definition !== undefined) {
      await v.update({ definition }, { transaction });
      // Only the owner renames the entry, and only while nothing of it is published.
      if (c.ownerId === actor.id && (version === 1 || !(await hasPublished(c.id, transaction)))) await Correlation.update(correlationMeta(definition), { where: { id: c.id }, transaction });
    }
    if (checkCases !== undefined) {
      await assertAttachmentRefs(actor, checkCases, transaction);
      await replaceCheckCases(v.id, checkCases as CheckCase[], transaction);
    }
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'version.edited', entityType: 'version', entityId: `${slug}@${version}`, details: { definition: definition !== undefined, checkCases: checkCases?.length ?? null } } });
    return { slug, version };
  });
  return result;
}

/** Remembers which correlation versions a template version pins ("what uses this version"). */
async function recordDependencies(templateVersionId: number, definition: TemplateDefinition, transaction: Transaction) {
  const { TemplateDependency } = db();
  const pinned = await loadPinnedVersions(pinsOf(definition), transaction);
  await TemplateDependency.bulkCreate([...pinned.values()].map((p) => ({ templateVersionId, versionId: p.id })), { transaction, ignoreDuplicates: true });
}

/** A template may be signed only while every correlation version it pins is still approved. */
async function assertPinsApproved(definition: TemplateDefinition, transaction: Transaction) {
  const pinned = await loadPinnedVersions(pinsOf(definition), transaction);
  const stale = [...pinned.values()].filter((p) => p.status !== 'approved');
  if (stale.length) {
    throw new AppError('conflict:pinned-version', `This template pins ${stale.map((p) => `${p.slug} version ${p.version} (${p.status.replace('_', ' ')})`).join(', ')}; a new template version must pin approved versions before it can be approved.`);
  }
}

async function hasPublished(correlationId: number, transaction: Transaction) {
  const { CorrelationVersion } = db();
  return (await CorrelationVersion.count({ where: { correlationId, status: { [Op.in]: ['approved', 'superseded', 'withdrawn'] } }, transaction })) > 0;
}

/** Live validation of a version's current content, stored nowhere. */
export async function previewValidation({ actor, slug, version }: { actor: AuthUser; slug: string; version: number }): Promise<ValidationReport> {
  const { Correlation, CorrelationVersion } = db();
  const c = await Correlation.findOne({ where: { slug } });
  const v = c && await CorrelationVersion.findOne({ where: { correlationId: c.id, version } });
  if (!c || !v || (v.authorId !== actor.id && !actor.roles.includes('approver'))) throw new AppError('not_found:version', `Correlation "${slug}" has no version ${version} you can see.`);
  return validateContent({ kind: c.kind, definition: v.definition, checkCases: await checkCasesOfVersion(v.id) });
}

/**
 * Submits a draft for review: validates it; when validation passes, freezes definition and check
 * cases under their content hash, records the validation run and tells the approvers. A failing
 * version changes nothing and the author gets the report.
 */
export async function submitVersion({ actor, slug, version }: { actor: AuthUser; slug: string; version: number }) {
  const { sequelize, ValidationRun } = db();
  const outcome = await sequelize.transaction(async (transaction) => {
    const c = await lockedCorrelation(slug, transaction);
    const v = await lockedVersion(c.id, slug, version, transaction);
    if (v.authorId !== actor.id) throw new AppError('forbidden:not-author', 'Only the author can submit a version.');
    if (v.status !== 'draft') throw new AppError('conflict:version-state', `Version ${version} is ${v.status.replace('_', ' ')}, not a draft; it cannot be submitted.`);
    const checkCases = await checkCasesOfVersion(v.id, transaction);
    const report = await validateContent({ kind: c.kind, definition: v.definition, checkCases, transaction });
    if (!report.passed) {
      const problems = report.stages.flatMap((s) => s.issues).filter((i) => i.stage !== 'coverage');
      throw new AppError('invalid:validation-failed', `Validation failed (${problems.length} problem${problems.length === 1 ? '' : 's'}); fix them before submitting.`, { report, issues: problems.map((p) => ({ path: p.pointer, message: p.message })) });
    }
    const hash = contentHash(v.definition, checkCases);
    await v.update({ status: 'in_review', contentHash: hash, submittedAt: new Date(), evidenceGrade: report.evidence?.grade ?? null }, { transaction });
    await ValidationRun.create({ versionId: v.id, engineVersion: report.engineVersion, passed: true, report }, { transaction });
    if (c.kind === 'template') await recordDependencies(v.id, v.definition as TemplateDefinition, transaction);
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'version.submitted', entityType: 'version', entityId: `${slug}@${version}`, afterHash: hash, details: { checkCases: checkCases.length, coverage: report.coverage.message } } });
    const approvers = (await usersWithRole({ role: 'approver' })).filter((u) => u.id !== actor.id);
    await enqueueMail({ transaction, messages: approvers.map((a): MailMessage => ({
      to: a.email, kind: 'submitted', versionId: v.id,
      subject: `[Correlary] Review requested: ${c.title}, version ${version}`,
      body: `${actor.name} submitted version ${version} of "${c.title}" (${slug}) for review.\nValidation passed: ${report.summary.passed}/${report.summary.checkCases} check cases.\nContent hash: ${hash}\n\nReview it at ${versionLink(slug, version)}`,
    })) });
    return { slug, version, status: 'in_review' as const, contentHash: hash, report };
  });
  await flushMail();
  return outcome;
}

/**
 * An approver's decision on a version in review. Four-eyes: never the author. Approval needs the
 * password again and records the meaning of the signature; it supersedes the previously approved
 * version in the same transaction. Row locks make concurrent decisions land exactly once.
 */
/**
 * A signature (approval, withdrawal) needs the signer's current password. Wrong passwords are throttled like
 * sign-in: a stolen session cannot guess its way to a signature.
 */
/** How recent a company-account sign-in must be to count as a signature (seconds). */
export const COMPANY_SIGNATURE_WINDOW_S = 300;

/**
 * A signature: the signer's current password, or — for a person signed in with their company account, who has no
 * Correlary password — a sign-in at the company's provider within the last five minutes.
 */
async function assertSignature(actor: AuthUser, password: string | undefined) {
  if (!password && actor.session?.via === 'company') {
    if (Date.now() / 1000 - actor.session.authAt <= COMPANY_SIGNATURE_WINDOW_S) return;
    throw new AppError('invalid:password', 'Confirm who you are with your company account (a sign-in within the last 5 minutes) to sign.', { issues: [{ path: 'password', message: 'Confirm with your company account' }] });
  }
  const me = await findUserById({ id: actor.id });
  if (!password) throw new AppError('invalid:password', 'Enter your current password: the signature needs it.', { issues: [{ path: 'password', message: 'Required to sign' }] });
  if (!me || !(await throttledCheck(personBuckets('sign-off', actor.id), 'sign-off', () => verifyPassword(password, me.passwordHash)))) {
    throw new AppError('invalid:password', 'The password is not correct; the signature needs your current password.', { issues: [{ path: 'password', message: 'Not correct' }] });
  }
}

export async function decideVersion({ actor, slug, version, decision, comment, password, waiver }: {
  actor: AuthUser; slug: string; version: number; decision: 'approve' | 'return'; comment: string; password?: string;
  /** Why the approver signs a version whose evidence is below the policy (required then, at least 20 characters). */
  waiver?: string;
}) {
  requireRole(actor, 'approver');
  if (decision === 'approve') await assertSignature(actor, password);
  if (decision === 'return' && !comment.trim()) {
    throw new AppError('invalid:comment', 'Say what the author should change.', { issues: [{ path: 'comment', message: 'A comment is required when returning a version' }] });
  }
  const { sequelize, CorrelationVersion, SignOff, VersionComment, ValidationRun, User } = db();
  await assertIntact({ slug, version });
  const outcome = await sequelize.transaction(async (transaction) => {
    const c = await lockedCorrelation(slug, transaction);
    const v = await lockedVersion(c.id, slug, version, transaction);
    if (v.authorId === actor.id) throw new AppError('forbidden:approve-own-version', 'You authored this version; another approver must review it (four-eyes rule).');
    if (v.status !== 'in_review') {
      const last = await SignOff.findOne({ where: { versionId: v.id }, order: [['id', 'DESC']], transaction });
      const who = last ? await User.findByPk(last.userId, { transaction }) : null;
      throw new AppError('conflict:version-state', `Version ${version} is already ${v.status.replace('_', ' ')}${who ? ` (decided by ${who.name} at ${last!.createdAt.toISOString()})` : ''}; your decision was not recorded.`);
    }
    const run = await ValidationRun.findOne({ where: { versionId: v.id }, order: [['id', 'DESC']], transaction });
    if (!run?.passed) throw new AppError('conflict:validation-failed', 'This version has no passing validation run and cannot be approved.');
    if (decision === 'approve' && c.kind === 'template') await assertPinsApproved(v.definition as TemplateDefinition, transaction);
    // The evidence policy in force now decides, on the counts the validation found.
    const evidence = (run.report as ValidationReport).evidence;
    const policy = await evidencePolicy();
    const belowPolicy = decision === 'approve' && c.kind === 'correlation' && (!evidence || !meetsPolicy(evidence, policy));
    const waived = belowPolicy ? (waiver ?? '').trim() : '';
    if (belowPolicy && waived.length < 20) {
      throw new AppError('conflict:evidence-below-policy', `The evidence is below the approval policy (${policy.minimumIndependent} independent in-range checks of ${policy.minimumKinds} kinds; this version has ${evidence?.independent ?? 0} of ${evidence?.kinds ?? 0}). Sign it only with a waiver that says why (at least 20 characters).`, { issues: [{ path: 'waiver', message: 'A waiver with its reason is needed to approve below the evidence policy' }], evidence, policy });
    }
    const now = new Date();
    const author = await User.findByPk(v.authorId, { transaction });
    let superseded: number | null = null;
    if (decision === 'approve') {
      const previous = await CorrelationVersion.findOne({ where: { correlationId: c.id, status: 'approved' }, transaction, lock: transaction.LOCK.UPDATE });
      if (previous) {
        await previous.update({ status: 'superseded', supersededAt: now }, { transaction });
        superseded = previous.version;
        await enqueueVersionEvent({ transaction, event: 'version.superseded', slug, data: { slug, version: previous.version, contentHash: previous.contentHash, successor: { version, contentHash: v.contentHash } } });
        await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'version.superseded', entityType: 'version', entityId: `${slug}@${previous.version}`, beforeHash: previous.contentHash, afterHash: previous.contentHash, details: { by: version } } });
      }
      await v.update({ status: 'approved', approvedAt: now, approvedById: actor.id }, { transaction });
      await enqueueVersionEvent({ transaction, event: 'version.approved', slug, data: { slug, version, contentHash: v.contentHash, approvedAt: now.toISOString(), supersedes: superseded } });
    } else {
      await v.update({ status: 'returned', returnedAt: now }, { transaction });
    }
    await SignOff.create({ versionId: v.id, userId: actor.id, decision: decision === 'approve' ? 'approved' : 'returned', comment: comment.trim(), meaning: decision === 'approve' ? MEANING_OF_APPROVAL : MEANING_OF_RETURN, contentHash: v.contentHash, waiver: waived || null }, { transaction });
    if (comment.trim()) await VersionComment.create({ versionId: v.id, userId: actor.id, body: comment.trim() }, { transaction });
    await appendAuditEvent({ transaction, event: {
      actorId: actor.id, action: decision === 'approve' ? 'version.approved' : 'version.returned', entityType: 'version', entityId: `${slug}@${version}`,
      beforeHash: v.contentHash, afterHash: v.contentHash, details: { comment: comment.trim(), meaning: decision === 'approve' ? MEANING_OF_APPROVAL : MEANING_OF_RETURN, superseded, ...(waived ? { waiver: waived, evidence: { independent: evidence?.independent ?? 0, kinds: evidence?.kinds ?? 0, policy } } : {}) },
    } });
    if (author) {
      await enqueueMail({ transaction, messages: [{
        to: author.email, kind: decision === 'approve' ? 'approved' : 'returned', versionId: v.id,
        subject: `[Correlary] ${c.title}, version ${version} ${decision === 'approve' ? 'approved' : 'returned to you'}`,
        body: `${actor.name} ${decision === 'approve' ? 'approved' : 'returned'} version ${version} of "${c.title}" (${slug}).${comment.trim() ? `\n\nComment: ${comment.trim()}` : ''}${superseded ? `\nVersion ${superseded} is now superseded.` : ''}\n\n${versionLink(slug, version)}`,
      }] });
    }
    return { slug, version, status: decision === 'approve' ? 'approved' : 'returned', superseded };
  }).finally(forgetServableVersions);
  await flushMail();
  return outcome;
}

/**
 * Withdraws an approved version with a reason. It stays readable but is never served as latest;
 * everyone who used it (API usage records, saved calculations) is told by e-mail.
 */
export async function withdrawVersion({ actor, slug, version, reason, password }: { actor: AuthUser; slug: string; version: number; reason: string; password?: string }) {
  requireRole(actor, 'approver');
  if (reason.trim().length < 10) throw new AppError('invalid:reason', 'Give the reason for withdrawal (at least 10 characters).', { issues: [{ path: 'reason', message: 'At least 10 characters' }] });
  // A withdrawal is signed like an approval: the approver's current password, throttled the same way.
  await assertSignature(actor, password);
  const { sequelize, SignOff, User } = db();
  const outcome = await sequelize.transaction(async (transaction) => {
    const c = await lockedCorrelation(slug, transaction);
    const v = await lockedVersion(c.id, slug, version, transaction);
    if (v.status !== 'approved') throw new AppError('conflict:version-state', `Only an approved version can be withdrawn; version ${version} is ${v.status.replace('_', ' ')}.`);
    await v.update({ status: 'withdrawn', withdrawnAt: new Date(), withdrawnReason: reason.trim() }, { transaction });
    await SignOff.create({ versionId: v.id, userId: actor.id, decision: 'withdrawn', comment: reason.trim(), meaning: MEANING_OF_WITHDRAWAL, contentHash: v.contentHash }, { transaction });
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'version.withdrawn', entityType: 'version', entityId: `${slug}@${version}`, beforeHash: v.contentHash, afterHash: v.contentHash, details: { reason: reason.trim() } } });
    const uses = await usesOfVersion(v.id, transaction);
    await enqueueVersionEvent({ transaction, event: 'version.withdrawn', slug, data: { slug, version, contentHash: v.contentHash, reason: reason.trim(), withdrawnAt: new Date().toISOString() } });
    for (const k of uses.calculations) {
      await enqueueVersionEvent({ transaction, event: 'calculation.flagged', slug, people: [k.ownerId, ...k.savedBy], data: { calculation: { id: k.id, title: k.title, project: k.project, url: `${appUrl()}/calculations/${k.id}` }, uses: { slug, version, contentHash: v.contentHash }, reason: reason.trim() } });
    }
    const affected = peopleToTell(uses);
    const users = affected.length ? await User.findAll({ where: { id: affected, isActive: true }, transaction }) : [];
    await enqueueMail({ transaction, messages: users.map((u) => {
      const calcs = uses.calculations.filter((k) => k.ownerId === u.id || k.savedBy.includes(u.id));
      const templates = uses.templates.filter((t) => t.authorId === u.id);
      const evaluated = uses.evaluations.find((e) => e.userId === u.id);
      const lines = [
        ...calcs.map((k) => `- calculation "${k.title}" in project "${k.project}" (now flagged): ${appUrl()}/calculations/${k.id}`),
        ...templates.map((t) => `- calculation template "${t.title}" version ${t.version} (${t.status.replace('_', ' ')}) pins it: ${appUrl()}/templates/${t.slug}`),
        ...(evaluated ? [`- ${evaluated.evaluations} evaluation${evaluated.evaluations === 1 ? '' : 's'}${evaluated.viaToken ? ' (some through the API)' : ''}`] : []),
      ];
      return {
        to: u.email, kind: 'withdrawn', versionId: v.id,
        subject: `[Correlary] Withdrawn: ${c.title}, version ${version}`,
        body: `Version ${version} of "${c.title}" (${slug}), content hash ${v.contentHash}, was withdrawn by ${actor.name}.\nReason: ${reason.trim()}\n\nYour work that used it:\n${lines.join('\n')}\n\nResults that depend on it should be reviewed.\n${versionLink(slug, version)}`,
      };
    }) });
    return { slug, version, status: 'withdrawn' as const, notified: users.map((u) => u.email) };
  }).finally(forgetServableVersions);
  await flushMail();
  return outcome;
}

export async function addComment({ actor, slug, version, body }: { actor: AuthUser; slug: string; version: number; body: string }) {
  const text = body.trim();
  if (!text) throw new AppError('invalid:comment', 'The comment is empty.', { issues: [{ path: 'body', message: 'Write a comment' }] });
  const { sequelize, Correlation, CorrelationVersion, VersionComment } = db();
  return sequelize.transaction(async (transaction) => {
    const c = await Correlation.findOne({ where: { slug }, transaction });
    const v = c && await CorrelationVersion.findOne({ where: { correlationId: c.id, version }, transaction });
    if (!c || !v) throw new AppError('not_found:version', `Correlation "${slug}" has no version ${version}.`);
    if (v.authorId !== actor.id && !actor.roles.includes('approver')) throw new AppError('forbidden:comment', 'Only the author and approvers can comment on a version.');
    const row = await VersionComment.create({ versionId: v.id, userId: actor.id, body: text.slice(0, 5000) }, { transaction });
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'version.commented', entityType: 'version', entityId: `${slug}@${version}`, details: { commentId: row.id } } });
    return { id: row.id };
  });
}
