'use client';

import type { Evidence } from '@/lib/engine/evidence';

const STYLE: Record<Evidence['grade'], string> = {
  'well-founded': 'border-ok/40 bg-ok-bg text-ok',
  adequate: 'border-brand/30 bg-brand-light text-brand-dark',
  thin: 'border-caution-line bg-caution-bg text-caution',
};

/** What the check cases prove: the grade in words, in-range checks by kind, coverage and stated accuracy. */
export function EvidenceSummary({ evidence }: { evidence: Evidence | undefined }) {
  if (!evidence) return <p className="text-sm text-ink-soft">No evidence grade: this report predates it, or validation stopped before the check cases.</p>;
  const kinds = Object.entries(evidence.byKind).sort(([a], [b]) => a.localeCompare(b));
  return (
    <div className={`rounded border px-3 py-2 text-sm ${STYLE[evidence.grade]}`} data-testid="evidence-summary">
      <p><strong>Evidence: {evidence.grade}</strong> — {evidence.meaning}.</p>
      <p className="text-xs">
        {evidence.independent} independent in-range check case{evidence.independent === 1 ? '' : 's'} of {evidence.kinds} kind{evidence.kinds === 1 ? '' : 's'}
        {' '}(policy: {evidence.policy.minimumIndependent} of {evidence.policy.minimumKinds}); by kind: {kinds.map(([k, n]) => `${k} ${n}`).join(', ') || 'none'}
        {(evidence.byKind.transcription ?? 0) > 0 && ' (transcriptions catch typos and count for nothing)'}; coverage of the validity ranges {Math.round(evidence.coverage * 100)} %.
      </p>
      <p className="mt-1 text-xs" data-testid="stated-accuracy">{accuracyText(evidence)}</p>
    </div>
  );
}

/** The stated accuracy in words: a band on data, a deviation from the correlation approximated, or exact within its model. */
export function accuracyText(evidence: Pick<Evidence, 'accuracy' | 'toleranceOverAccuracy'>): string {
  const a = evidence.accuracy;
  if (!a) return 'No stated accuracy.';
  const pct = `±${Number((a.rel * 100).toPrecision(2))} %`;
  const head = a.rel === 0 ? 'Exact within the model it states' : a.approximates ? `Stated accuracy: within ${pct} of ${a.approximates}` : `Stated accuracy: ${pct} on data`;
  const loose = evidence.toleranceOverAccuracy !== null ? `; loosest in-range check tolerance ${evidence.toleranceOverAccuracy.toPrecision(2)}× that accuracy` : '';
  return `${head} — ${a.basis}${loose}.`;
}
