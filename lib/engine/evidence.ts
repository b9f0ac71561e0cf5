import type { Accuracy, CheckCase, Definition, SourceKind } from './types';

/**
 * How much a version's check cases prove, computed at validation. Free of mathjs (the browser shows it).
 *
 * Independent evidence is every in-range, passing check case except a transcription (a re-typed
 * formula proves only that two copies agree). Memory counts but never alone.
 */
export interface EvidencePolicy {
  /** Independent in-range check cases a version needs before it may be approved without a waiver. */
  minimumIndependent: number;
  /** …of at least this many different kinds. */
  minimumKinds: number;
}

export const DEFAULT_POLICY: EvidencePolicy = { minimumIndependent: 3, minimumKinds: 2 };

export const GRADES = ['well-founded', 'adequate', 'thin'] as const;
export type Grade = (typeof GRADES)[number];

export const GRADE_MEANING: Record<Grade, string> = {
  'well-founded': 'meets the approval policy, holds a published or standard-formulation value, and its checks reach across every bounded input range',
  adequate: 'meets the approval policy minimum of independent checks',
  thin: 'below the approval policy minimum: approval needs a recorded waiver with its reason',
};

export interface Evidence {
  grade: Grade;
  meaning: string;
  /** In-range, passing check cases by kind. */
  byKind: Partial<Record<SourceKind, number>>;
  independent: number;
  kinds: number;
  published: boolean;
  /** Fraction of the thirds of every bounded input range touched by in-range checks (0–1). */
  coverage: number;
  /** Largest in-range tolerance over the stated accuracy (a check looser than the accuracy proves little). */
  toleranceOverAccuracy: number | null;
  accuracy: Accuracy | null;
  policy: EvidencePolicy;
  meetsPolicy: boolean;
}

export function meetsPolicy(e: Pick<Evidence, 'independent' | 'kinds' | 'byKind'>, policy: EvidencePolicy): boolean {
  const nonMemory = e.independent - (e.byKind.memory ?? 0);
  return e.independent >= policy.minimumIndependent && e.kinds >= policy.minimumKinds && nonMemory > 0;
}

export function evidenceOf({ definition, checkCases, passed, coverage, policy = DEFAULT_POLICY }: {
  definition: Pick<Definition, 'accuracy'>;
  checkCases: CheckCase[];
  /** Whether each check case passed and stayed inside every range. */
  passed: boolean[];
  coverage: { touched: boolean[] }[];
  policy?: EvidencePolicy;
}): Evidence {
  const byKind: Partial<Record<SourceKind, number>> = {};
  let looseness: number | null = null;
  checkCases.forEach((c, i) => {
    if (!passed[i] || c.expectWarnings?.length || c.expectRefusal) return;
    byKind[c.source.kind] = (byKind[c.source.kind] ?? 0) + 1;
    if (definition.accuracy && definition.accuracy.rel > 0 && c.source.kind !== 'transcription' && c.tolerance.rel !== undefined) {
      looseness = Math.max(looseness ?? 0, c.tolerance.rel / definition.accuracy.rel);
    }
  });
  const independentKinds = (Object.keys(byKind) as SourceKind[]).filter((k) => k !== 'transcription');
  const independent = independentKinds.reduce((n, k) => n + (byKind[k] ?? 0), 0);
  const thirds = coverage.flatMap((e) => e.touched);
  const cover = thirds.length ? thirds.filter(Boolean).length / thirds.length : 0;
  const base = { byKind, independent, kinds: independentKinds.length };
  const ok = meetsPolicy(base, policy);
  const strong = ok && Boolean(byKind.published || byKind['standard-formulation']) && coverage.every((e) => e.touched.filter(Boolean).length >= 2);
  const grade: Grade = strong ? 'well-founded' : ok ? 'adequate' : 'thin';
  return {
    grade, meaning: GRADE_MEANING[grade], ...base, published: Boolean(byKind.published), coverage: Number(cover.toFixed(3)),
    toleranceOverAccuracy: looseness === null ? null : Number((looseness as number).toFixed(3)), accuracy: definition.accuracy ?? null, policy, meetsPolicy: ok,
  };
}

/**
 * The tolerance a cross-check between two correlations may use, from their stated accuracies: when one
 * approximates the other, its stated deviation; when both approximate the same third, the sum of their
 * deviations; otherwise the two accuracies on data combined as independent errors, √(a² + b²). Rounded
 * up to 0.1 %. Null when either has no stated accuracy (no cross-check can then be justified).
 */
export function crossCheckTolerance(a: { slug: string; accuracy?: Accuracy | null }, b: { slug: string; accuracy?: Accuracy | null }): number | null {
  if (!a.accuracy || !b.accuracy) return null;
  const up = (x: number) => Math.ceil(x * 1000 - 1e-9) / 1000;
  if (a.accuracy.approximates === b.slug) return up(a.accuracy.rel);
  if (b.accuracy.approximates === a.slug) return up(b.accuracy.rel);
  if (a.accuracy.approximates && a.accuracy.approximates === b.accuracy.approximates) return up(a.accuracy.rel + b.accuracy.rel);
  // Two exact relations still differ by the rounding of their published constants: at least 0.1 %.
  return up(Math.max(Math.hypot(a.accuracy.rel, b.accuracy.rel), 1e-9));
}
