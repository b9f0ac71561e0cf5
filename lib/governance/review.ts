import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { compareDefinitions } from '@/lib/engine';
import { loadVerifiedCorrelation } from '@/lib/evaluation/verified';
import { boundsOf, typicalValue } from '@/lib/engine/ranges';
import { previousApproved } from './queries';

/**
 * Numerical difference of a version from the previously approved one across the validity range of
 * one input (the first bounded one unless chosen), the others held at typical values.
 */
export async function deviationFromPrevious({ actor, slug, version, sweep, output }: { actor: AuthUser; slug: string; version: number; sweep?: string; output?: string }) {
  const cur = (await loadVerifiedCorrelation({ actor, slug, version })).compiled.definition;
  const prev = await previousApproved({ slug, before: version });
  if (!prev) return { previous: null, comparison: null, message: 'This is the first version to be approved: there is nothing to compare with.' };
  const old = (await loadVerifiedCorrelation({ actor, slug, version: prev.version })).compiled.definition;
  const common = cur.inputs.map((i) => i.symbol).filter((s) => old.inputs.some((o) => o.symbol === s));
  if (common.length !== cur.inputs.length || common.length !== old.inputs.length) {
    return { previous: prev.version, comparison: null, message: 'The inputs changed between versions, so the two cannot be compared point by point.' };
  }
  const bounded = common.filter((s) => { const b = boundsOf(cur, s); return b.min !== undefined && b.max !== undefined; });
  const sweepSymbol = sweep ?? bounded[0] ?? common[0];
  if (!common.includes(sweepSymbol)) throw new AppError('invalid:sweep', `"${sweepSymbol}" is not an input of both versions.`);
  const outSymbol = output ?? cur.outputs[0].symbol;
  if (!old.outputs.some((o) => o.symbol === outSymbol)) {
    return { previous: prev.version, comparison: null, message: `The previous version has no output "${outSymbol}".` };
  }
  const fixed = Object.fromEntries(common.filter((s) => s !== sweepSymbol).map((s) => [s, typicalValue(cur, s)]));
  const { min, max } = boundsOf(cur, sweepSymbol);
  const from = min !== undefined && (min > 0 || max === undefined) ? min : min ?? (max !== undefined ? max / 1000 : 1);
  const to = max ?? (from > 0 ? from * 1000 : from + 1000);
  const comparison = compareDefinitions({
    items: [{ label: `version ${prev.version}`, definition: old }, { label: `version ${version}`, definition: cur }],
    sweep: sweepSymbol, output: outSymbol, fixed, from: from === 0 && to > 0 ? to / 1e6 : from, to, points: 120,
  });
  return { previous: prev.version, fixed, comparison, message: null };
}
