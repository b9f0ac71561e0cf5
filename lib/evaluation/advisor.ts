import 'server-only';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { EvaluationError, InputError } from '@/lib/engine/compile';
import { bandOf, type Band } from '@/lib/engine/uncertainty';
import type { Warning } from '@/lib/engine/types';
import { consumeRateLimit } from '@/lib/api/rate-limit';
import { recordUsage } from '@/lib/api/usage';
import { loadVerifiedCorrelation } from './verified';
import { RANKING_RULE } from '@/lib/api/contract';

/**
 * The applicability advisor: every approved correlation for a situation, evaluated at one point, with
 * where the point breaks its validity ranges, its value, band and evidence grade, the spread between
 * them, and (optionally) a sweep of one input for a plot.
 *
 * Ranking rule (stated in the answer): inside every validity range first; then evidence grade
 * (well-founded, adequate, thin); then the narrower band; then title.
 */
export const MAX_CANDIDATES = 40;
export const MAX_SWEEP_POINTS = 200;

const GRADE_ORDER: Record<string, number> = { 'well-founded': 0, adequate: 1, thin: 2 };

export interface AdviceRequest {
  situation?: string;
  /** A correlation whose situation to use (from a template step, say). */
  like?: string;
  inputs: Record<string, number>;
  output?: string;
  sweep?: { symbol: string; from: number; to: number; points?: number; log?: boolean };
}

export interface Break { symbol: string; value: number; min?: number; max?: number; factor: number; message: string }

/** How far outside: the value over the bound it breaks (0.3 = 30 % of the minimum, 2 = twice the maximum). */
function breakOf(w: Warning): Break {
  const bound = w.min !== undefined && w.value < w.min ? w.min : w.max !== undefined && w.value > w.max ? w.max : (w.min ?? w.max ?? w.value);
  return { symbol: w.symbol, value: w.value, ...(w.min !== undefined ? { min: w.min } : {}), ...(w.max !== undefined ? { max: w.max } : {}), factor: bound === 0 ? Infinity : w.value / bound, message: w.message };
}

/** The situations with approved correlations, each with the inputs and outputs its correlations take and give. */
export async function situations() {
  const { sequelize } = db();
  const rows = await sequelize.query<{ category: string; situation: string; slug: string; definition: string }>(`
    SELECT c.category, c.situation, c.slug, a.definition FROM correlations c
    JOIN correlation_versions a ON a.correlation_id = c.id AND a.status = 'approved'
    WHERE c.kind = 'correlation' ORDER BY c.category, c.situation, c.slug`, { type: QueryTypes.SELECT });
  const by = new Map<string, { category: string; situation: string; correlations: number; inputs: Set<string>; outputs: Map<string, number> }>();
  for (const r of rows) {
    const d = JSON.parse(r.definition) as { inputs: { symbol: string }[]; outputs: { symbol: string }[] };
    const k = `${r.category}|${r.situation}`;
    const s = by.get(k) ?? { category: r.category, situation: r.situation, correlations: 0, inputs: new Set<string>(), outputs: new Map<string, number>() };
    s.correlations++;
    d.inputs.forEach((i) => s.inputs.add(i.symbol));
    d.outputs.forEach((o) => s.outputs.set(o.symbol, (s.outputs.get(o.symbol) ?? 0) + 1));
    by.set(k, s);
  }
  return {
    situations: [...by.values()].map((s) => ({
      category: s.category, situation: s.situation, correlations: s.correlations, inputs: [...s.inputs],
      outputs: [...s.outputs].sort((a, b) => b[1] - a[1]).map(([o]) => o),
    })),
  };
}

export async function advise({ actor, tokenId, request }: { actor: AuthUser; tokenId: number | null; request: AdviceRequest }) {
  const { sequelize, Correlation } = db();
  let situation = request.situation;
  if (!situation && request.like) {
    const c = await Correlation.findOne({ where: { slug: request.like, kind: 'correlation' } });
    if (!c) throw new AppError('not_found:correlation', `No correlation "${request.like}".`);
    situation = c.situation;
  }
  if (!situation) throw new AppError('invalid:advice', 'Give a situation (for example "circular tube") or a correlation it is like.', { issues: [{ path: 'situation', message: 'give a situation or "like"' }] });
  const rows = await sequelize.query<{ slug: string; title: string; grade: string | null }>(`
    SELECT c.slug, c.title, a.evidence_grade AS grade FROM correlations c
    JOIN correlation_versions a ON a.correlation_id = c.id AND a.status = 'approved'
    WHERE c.kind = 'correlation' AND c.situation = :situation ORDER BY c.title LIMIT ${MAX_CANDIDATES}`, { replacements: { situation }, type: QueryTypes.SELECT });
  if (!rows.length) throw new AppError('not_found:situation', `No approved correlation for the situation "${situation}".`);
  const sweep = request.sweep;
  const points = sweep ? Math.min(Math.max(Math.round(sweep.points ?? 60), 2), MAX_SWEEP_POINTS) : 0;
  await consumeRateLimit({ userId: actor.id, tokenId, evaluations: rows.length * (1 + points) });

  const loaded = await Promise.all(rows.map(async (r) => ({ row: r, v: await loadVerifiedCorrelation({ actor, slug: r.slug }) })));
  const counts = new Map<string, number>();
  for (const { v } of loaded) for (const s of v.compiled.outputSymbols) counts.set(s, (counts.get(s) ?? 0) + 1);
  // The compared output: the one asked for, else the first output of the correlation it is "like", else the most common.
  const likeOutput = request.like ? loaded.find((l) => l.row.slug === request.like)?.v.compiled.outputSymbols[0] : undefined;
  const output = request.output ?? likeOutput ?? [...counts].sort((a, b) => b[1] - a[1])[0][0];
  if (!counts.has(output)) throw new AppError('invalid:advice', `No correlation for "${situation}" gives ${output}; they give ${[...counts.keys()].join(', ')}.`, { issues: [{ path: 'output', message: `not an output here` }] });

  const xs = sweep ? Array.from({ length: points }, (_, k) => {
    const u = k / (points - 1);
    return sweep.log ?? (sweep.from > 0 && sweep.to / sweep.from >= 100) ? Math.exp(Math.log(sweep.from) + u * (Math.log(sweep.to) - Math.log(sweep.from))) : sweep.from + u * (sweep.to - sweep.from);
  }) : [];

  const candidates = loaded.map(({ row, v }) => {
    const c = v.compiled;
    const base = { slug: row.slug, title: row.title, version: v.version.version, contentHash: v.version.contentHash, grade: row.grade, band: bandOf(c.definition.accuracy, output) as Band | null, inputs: c.inputSymbols };
    if (!c.outputSymbols.includes(output)) return { ...base, status: 'other-output' as const, note: `gives ${c.outputSymbols.join(', ')}, not ${output}`, value: null, breaks: [] as Break[], series: null };
    const missing = c.inputSymbols.filter((s) => request.inputs[s] === undefined);
    if (missing.length) return { ...base, status: 'needs-inputs' as const, note: `needs ${missing.join(', ')}`, missing, value: null, breaks: [] as Break[], series: null };
    const own = Object.fromEntries(c.inputSymbols.map((s) => [s, request.inputs[s]]));
    let value: number | null = null;
    let breaks: Break[] = [];
    let status: 'inside' | 'outside' | 'refused' = 'inside';
    let note: string | undefined;
    try {
      const r = c.evaluate(own);
      value = r.outputs[output];
      breaks = r.warnings.map(breakOf);
      if (breaks.length) status = 'outside';
    } catch (err) {
      if (!(err instanceof EvaluationError) && !(err instanceof InputError)) throw err;
      status = 'refused';
      note = err.message;
      if (err instanceof EvaluationError) breaks = err.warnings.map(breakOf);
    }
    let series: { x: number; y: number | null; inside: boolean }[] | null = null;
    if (sweep && c.inputSymbols.includes(sweep.symbol)) {
      const k = c.inputSymbols.indexOf(sweep.symbol);
      const flat = new Float64Array(points * c.inputSymbols.length);
      xs.forEach((x, row) => c.inputSymbols.forEach((s, i) => { flat[row * c.inputSymbols.length + i] = i === k ? x : own[s]; }));
      const out = c.runMany(flat, points);
      const j = c.outputSymbols.indexOf(output);
      series = xs.map((x, row) => {
        const y = out.errors.has(row) ? null : out.outputs[row * c.outputSymbols.length + j];
        return { x, y: y !== null && Number.isFinite(y) ? y : null, inside: !out.warnings.has(row) && !out.errors.has(row) };
      });
    }
    recordUsage({ userId: actor.id, tokenId, versionId: v.version.id, evaluations: 1 + (series ? points : 0) });
    return { ...base, status, ...(note ? { note } : {}), value, breaks, series };
  });

  const rank = (x: (typeof candidates)[number]) => [
    x.status === 'inside' ? 0 : x.status === 'outside' ? 1 : 2,
    GRADE_ORDER[x.grade ?? ''] ?? 3,
    x.band?.rel ?? Infinity,
  ];
  candidates.sort((a, b) => {
    const ra = rank(a); const rb = rank(b);
    for (let i = 0; i < ra.length; i++) if (ra[i] !== rb[i]) return ra[i] - rb[i];
    return a.title.localeCompare(b.title);
  });
  const spreadOf = (values: number[]) => {
    if (values.length < 2) return null;
    const sorted = [...values].sort((a, b) => a - b);
    const median = sorted.length % 2 ? sorted[(sorted.length - 1) / 2] : (sorted[sorted.length / 2 - 1] + sorted[sorted.length / 2]) / 2;
    return { min: sorted[0], max: sorted[sorted.length - 1], median, rel: (sorted[sorted.length - 1] - sorted[0]) / median, count: values.length };
  };
  const inside = candidates.filter((c) => c.status === 'inside' && c.value !== null).map((c) => c.value!);
  const evaluated = candidates.filter((c) => (c.status === 'inside' || c.status === 'outside') && c.value !== null).map((c) => c.value!);
  return {
    situation, output, inputs: request.inputs, ranking: RANKING_RULE,
    spread: { inside: spreadOf(inside), all: spreadOf(evaluated) },
    sweep: sweep ? { symbol: sweep.symbol, x: xs } : null,
    candidates: candidates.map((c, i) => ({ rank: i + 1, ...c })),
  };
}
