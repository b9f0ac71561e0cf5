import 'server-only';
import { QueryTypes } from 'sequelize';
import { db, type Calculation, type CalculationRevision } from '@/models';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { userLabels } from '@/lib/auth/labels';
import { appendAuditEvent } from '@/lib/audit/log';
import { canonicalJson, sha256Hex } from '@/lib/engine/canonical';
import { ENGINE_VERSION } from '@/lib/engine/validate';
import { compileChain } from '@/lib/engine/chain';
import { pinsOf, type ChainResult, type Pin, type TemplateDefinition } from '@/lib/engine/template-types';
import { loadOwnChain, loadVerifiedTemplate, resolvePins } from '@/lib/evaluation/verified';
import { runChain, type EvaluateRequest } from '@/lib/evaluation/service';
import { flaggedCalculations, projectFor } from './projects';
import { consumeRateLimit } from '@/lib/api/rate-limit';

/** What a saved revision holds, frozen under its content hash. */
export interface RevisionContent {
  format: 1;
  engineVersion: string;
  title: string;
  template: { slug: string; version: number; contentHash: string | null; title: string } | null;
  chain: TemplateDefinition;
  request: { inputs?: Record<string, unknown>; rows?: unknown[] };
  answer: Awaited<ReturnType<typeof runChain>>;
  ranBy: string;
  ranAt: string;
}

export const revisionHash = (content: unknown) => sha256Hex(canonicalJson(content));

export interface SaveRequest extends EvaluateRequest {
  project: number;
  title: string;
  note?: string;
  /** Save as the next revision of this calculation (same project). */
  calculation?: number;
  template?: { slug: string; version?: number };
  chain?: unknown;
}

/**
 * Runs and saves a calculation (or its next revision). The server runs it itself — a client never
 * supplies results — and freezes inputs, every intermediate value, versions, hashes, engine
 * version, who and when under one content hash. Which versions it used is indexed for withdrawal.
 */
export async function saveCalculation({ actor, tokenId, request }: { actor: AuthUser; tokenId: number | null; request: SaveRequest }) {
  if ((request.template === undefined) === (request.chain === undefined)) {
    throw new AppError('invalid:calculation', 'Give either "template" (a governed template) or "chain" (your own chain of steps).', { issues: [{ path: 'template', message: 'give a template or a chain' }] });
  }
  const { project } = await projectFor(actor, request.project, 'edit');
  const runnable = request.template
    ? await loadVerifiedTemplate({ actor, slug: request.template.slug, version: request.template.version })
    : await loadOwnChain(request.chain);
  if (runnable.template && runnable.template.status !== 'approved') {
    throw new AppError('invalid:template', `Version ${runnable.template.version} of "${runnable.template.slug}" is ${runnable.template.status.replace('_', ' ')}; calculations are saved from approved templates only.`);
  }
  const answer = await runChain({ actor, tokenId, runnable, request: { inputs: request.inputs, rows: request.rows } });
  const content: RevisionContent = {
    format: 1, engineVersion: ENGINE_VERSION, title: request.title.trim(),
    template: runnable.template && { slug: runnable.template.slug, version: runnable.template.version, contentHash: runnable.template.contentHash, title: runnable.template.title },
    chain: runnable.chain.definition,
    request: request.rows ? { rows: request.rows } : { inputs: request.inputs ?? {} },
    answer, ranBy: actor.name, ranAt: new Date().toISOString(),
  };
  const hash = revisionHash(content);
  const { sequelize, Calculation, CalculationRevision, CalculationUse } = db();
  return sequelize.transaction(async (transaction) => {
    let calc: Calculation;
    if (request.calculation !== undefined) {
      const found = await Calculation.findByPk(request.calculation, { transaction, lock: transaction.LOCK.UPDATE });
      if (!found || found.projectId !== project.id) throw new AppError('not_found:calculation', `No calculation ${request.calculation} in this project.`);
      calc = found;
      await calc.update({ latestRevision: calc.latestRevision + 1, title: content.title }, { transaction });
    } else {
      calc = await Calculation.create({ projectId: project.id, title: content.title, ownerId: actor.id, latestRevision: 1 }, { transaction });
    }
    const rev = await CalculationRevision.create({
      calculationId: calc.id, revision: calc.latestRevision, templateVersionId: runnable.template?.id ?? null,
      content, contentHash: hash, note: (request.note ?? '').trim().slice(0, 500), createdBy: actor.id,
    }, { transaction });
    await CalculationUse.bulkCreate([...new Set(runnable.usedVersionIds)].map((versionId) => ({ revisionId: rev.id, versionId })), { transaction });
    await appendAuditEvent({ transaction, event: {
      actorId: actor.id, action: 'calculation.saved', entityType: 'calculation', entityId: `${calc.id}@${calc.latestRevision}`, afterHash: hash,
      details: { project: project.id, template: content.template ? `${content.template.slug}@${content.template.version}` : null, rows: request.rows?.length ?? null },
    } });
    await project.update({ updatedAt: new Date() }, { transaction });
    return { id: calc.id, revision: calc.latestRevision, contentHash: hash, project: project.id };
  });
}

async function calculationFor(actor: AuthUser, id: number) {
  const { Calculation } = db();
  const calc = await Calculation.findByPk(id);
  if (!calc) throw new AppError('not_found:calculation', `No calculation ${id} you can see.`);
  try {
    const { project, access } = await projectFor(actor, calc.projectId);
    return { calc, project, access };
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found:project') throw new AppError('not_found:calculation', `No calculation ${id} you can see.`);
    throw err;
  }
}

async function verifiedRevision(calc: Calculation, revision: number): Promise<CalculationRevision> {
  const { CalculationRevision, sequelize } = db();
  const rev = await CalculationRevision.findOne({ where: { calculationId: calc.id, revision } });
  if (!rev) throw new AppError('not_found:revision', `Calculation ${calc.id} has no revision ${revision}.`);
  const actual = revisionHash(rev.content);
  if (actual !== rev.contentHash) {
    await sequelize.transaction((transaction) => appendAuditEvent({ transaction, event: {
      actorId: null, action: 'integrity.hash-mismatch', entityType: 'calculation', entityId: `${calc.id}@${revision}`, beforeHash: rev.contentHash, afterHash: actual,
      details: { alarm: 'Stored calculation revision does not match its content hash; it is not shown.' },
    } }));
    throw new AppError('conflict:content-hash-mismatch', `Revision ${revision} of calculation ${calc.id} does not match its content hash and is not shown; the incident is recorded in the audit trail.`);
  }
  return rev;
}

/** A saved calculation (a revision, default the latest), integrity-checked, with its flags and history. */
export async function getCalculation({ actor, id, revision }: { actor: AuthUser; id: number; revision?: number }) {
  const { calc, project, access } = await calculationFor(actor, id);
  const rev = await verifiedRevision(calc, revision ?? calc.latestRevision);
  const { CalculationRevision, sequelize } = db();
  const history = await CalculationRevision.findAll({ where: { calculationId: calc.id }, attributes: ['revision', 'contentHash', 'note', 'createdBy', 'createdAt'], order: [['revision', 'DESC']] });
  const names = await userLabels({ ids: [calc.ownerId, ...history.map((h) => h.createdBy)] });
  // Flags of this revision: every version it used that has since been withdrawn.
  const flags = await sequelize.query<{ slug: string; version: number; reason: string | null; withdrawn_at: Date }>(`
    SELECT c.slug, v.version, v.withdrawn_reason AS reason, v.withdrawn_at FROM calculation_uses u
    JOIN correlation_versions v ON v.id = u.version_id AND v.status = 'withdrawn' JOIN correlations c ON c.id = v.correlation_id
    WHERE u.revision_id = ?`, { replacements: [rev.id], type: QueryTypes.SELECT });
  return {
    id: calc.id, title: calc.title, project: { id: project.id, name: project.name }, owner: names.get(calc.ownerId) ?? '?',
    revision: rev.revision, latestRevision: calc.latestRevision, contentHash: rev.contentHash, note: rev.note,
    savedBy: names.get(rev.createdBy) ?? '?', savedAt: rev.createdAt, canEdit: access.edit,
    content: rev.content as RevisionContent,
    flags: flags.map((f) => ({ slug: f.slug, version: f.version, reason: f.reason, withdrawnAt: f.withdrawn_at })),
    revisions: history.map((h) => ({ revision: h.revision, contentHash: h.contentHash, note: h.note, by: names.get(h.createdBy) ?? '?', at: h.createdAt })),
  };
}

export async function listCalculations({ actor, project }: { actor: AuthUser; project: number }) {
  await projectFor(actor, project);
  const { Calculation } = db();
  const calcs = await Calculation.findAll({ where: { projectId: project }, order: [['updatedAt', 'DESC']], limit: 500 });
  const flags = await flaggedCalculations(calcs.map((c) => c.id));
  return { items: calcs.map((c) => ({ id: c.id, title: c.title, revision: c.latestRevision, updatedAt: c.updatedAt, flagged: flags.has(c.id) })), total: calcs.length };
}

/**
 * Re-runs a saved revision's inputs with every pinned correlation moved to its latest approved
 * version, and says step by step what changed and by how much. Nothing is saved.
 */
export async function rerunCalculation({ actor, tokenId, id, revision }: { actor: AuthUser; tokenId: number | null; id: number; revision?: number }) {
  const { calc } = await calculationFor(actor, id);
  const rev = await verifiedRevision(calc, revision ?? calc.latestRevision);
  const content = rev.content as RevisionContent;
  if (content.request.rows) throw new AppError('invalid:rerun', 'A parametric calculation is re-run by running its table again from the template; re-run and compare works on single calculations.');
  const saved = content.answer as unknown as ChainResult;
  const pins = pinsOf(content.chain);
  const { sequelize } = db();
  const latest = pins.length ? await sequelize.query<{ slug: string; version: number; content_hash: string }>(`
    SELECT c.slug, v.version, v.content_hash FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id
    WHERE v.status = 'approved' AND c.kind = 'correlation' AND c.slug IN (:slugs)`, { replacements: { slugs: [...new Set(pins.map((p) => p.slug))] }, type: QueryTypes.SELECT }) : [];
  const newest = new Map(latest.map((l) => [l.slug, { slug: l.slug, version: l.version, contentHash: l.content_hash } satisfies Pin]));
  const rebased = structuredClone(content.chain);
  const moved: { slug: string; from: number; to: number | null }[] = [];
  const visit = (s: TemplateDefinition['steps'][number]) => {
    if (s.kind === 'choice') { s.options.forEach((o) => o.steps.forEach(visit)); return; }
    if (s.kind !== 'correlation') return;
    const n = newest.get(s.use.slug);
    if (!moved.some((m) => m.slug === s.use.slug)) moved.push({ slug: s.use.slug, from: s.use.version, to: n?.version ?? null });
    if (n) s.use = n;
  };
  rebased.steps.forEach(visit);
  const { resolve } = await resolvePins(pinsOf(rebased), { forApproval: false });
  let now: ChainResult;
  try {
    const chain = compileChain(rebased, resolve);
    await consumeRateLimit({ userId: actor.id, tokenId, evaluations: chain.stepsPerRow });
    now = chain.runDetailed(chain.readInputs(content.request.inputs ?? {}, 'inputs'));
  } catch (err) {
    return { revision: rev.revision, moved, error: `The latest approved versions no longer fit this chain: ${(err as Error).message.slice(0, 400)}`, steps: [], outputs: [] };
  }
  const rel = (a: number, b: number) => (a === b ? 0 : a === 0 ? null : (b - a) / Math.abs(a));
  const steps = now.steps.map((s) => {
    const before = saved.steps.find((x) => x.key === s.key);
    return {
      key: s.key, title: s.title, before: before?.correlation ?? null, after: s.correlation, pickedBefore: before?.choice?.picked ?? null, pickedAfter: s.choice?.picked ?? null,
      outputs: Object.entries(s.outputs).map(([symbol, value]) => ({ symbol, before: before?.outputs[symbol] ?? null, after: value, change: before?.outputs[symbol] !== undefined ? rel(before.outputs[symbol], value) : null })),
      warnings: s.warnings,
    };
  });
  const outputs = Object.entries(now.outputs).map(([symbol, value]) => ({ symbol, before: saved.outputs[symbol] ?? null, after: value, change: saved.outputs[symbol] !== undefined ? rel(saved.outputs[symbol], value) : null }));
  return { revision: rev.revision, moved, error: null, steps, outputs };
}

/** CSV of a saved revision: one row per step output (single) or per case (parametric). */
export async function calculationCsv({ actor, id, revision }: { actor: AuthUser; id: number; revision?: number }): Promise<{ filename: string; text: string }> {
  const { content, revision: n, contentHash, title } = await getCalculation({ actor, id, revision });
  const q = (v: unknown) => { const s = v === null || v === undefined ? '' : String(v); return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s; };
  const lines: string[] = [`# ${title}, revision ${n}, content hash ${contentHash}`];
  const answer = content.answer as unknown as { units: Record<string, string>; steps?: ChainResult['steps']; results?: { outputs: Record<string, number> | null; warnings: { step: string; message: string }[]; picked: Record<string, string | null>; error?: { message: string } }[] };
  if (answer.results) {
    const inputs = content.chain.inputs.map((i) => i.symbol);
    const outs = Object.keys(answer.units);
    lines.push([...inputs.map((s) => `${s} [${content.chain.inputs.find((i) => i.symbol === s)!.unit}]`), ...outs.map((s) => `${s} [${answer.units[s]}]`), 'choices', 'warnings'].map(q).join(','));
    const rows = content.request.rows as Record<string, unknown>[];
    answer.results.forEach((r, i) => {
      const ins = inputs.map((s) => { const v = rows[i][s]; return typeof v === 'object' && v !== null ? `${(v as { value: number }).value} ${(v as { unit: string }).unit}` : v; });
      lines.push([...ins, ...outs.map((s) => r.outputs?.[s] ?? ''), Object.entries(r.picked).map(([k, v]) => `${k}: ${v}`).join('; '), [r.error?.message, ...r.warnings.map((w) => `${w.step}: ${w.message}`)].filter(Boolean).join(' | ')].map(q).join(','));
    });
  } else {
    lines.push(['step', 'correlation', 'symbol', 'value', 'unit', 'warnings'].map(q).join(','));
    for (const s of answer.steps ?? []) {
      for (const [symbol, value] of Object.entries(s.outputs)) {
        lines.push([s.key, s.correlation ? `${s.correlation.slug}@${s.correlation.version} ${s.correlation.contentHash}` : '', symbol, value, s.units[symbol] ?? '', s.warnings.map((w) => w.message).join(' | ')].map(q).join(','));
      }
    }
  }
  return { filename: `calculation-${id}-r${n}.csv`, text: `${lines.join('\n')}\n` };
}
