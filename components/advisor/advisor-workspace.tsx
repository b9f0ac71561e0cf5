'use client';

import Link from 'next/link';
import { useMutation, useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'next/navigation';
import { useEffect, useMemo, useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { formatNumber } from '@/lib/client/units';
import { bandText, percent as pct } from '@/lib/client/bands';
import type { ApiAnswer } from '@/lib/client/typed';
import { SeriesChart, type ChartSeries } from '@/components/charts/series-chart';
import { Caution } from '@/components/ui/caution';
import { Sym } from '@/components/ui/sym';

type Advice = ApiAnswer<'/api/advice', 'post'>;
type Situations = ApiAnswer<'/api/advice', 'get'>;

const STATUS: Record<Advice['candidates'][number]['status'], { text: string; cls: string }> = {
  inside: { text: 'inside its ranges', cls: 'bg-ok-bg text-ok' },
  outside: { text: 'outside a range', cls: 'bg-caution-bg text-caution' },
  refused: { text: 'refused (hard limit)', cls: 'bg-danger-bg text-danger' },
  'needs-inputs': { text: 'needs more inputs', cls: 'bg-paper-sunk text-ink-soft' },
  'other-output': { text: 'other outputs', cls: 'bg-paper-sunk text-ink-soft' },
};
const GRADE_CLS: Record<string, string> = { 'well-founded': 'text-ok', adequate: 'text-brand-dark', thin: 'text-caution' };

function breakText(b: Advice['candidates'][number]['breaks'][number]) {
  const below = b.min !== undefined && b.value < b.min;
  const bound = below ? b.min! : b.max!;
  if (bound === undefined) return b.message;
  return `${b.symbol} = ${formatNumber(b.value, 4)} is ${below ? 'below' : 'above'} ${formatNumber(bound, 4)} (${formatNumber(b.factor, 2)}× the bound)`;
}

/** The advisor: a situation, the point, the ranked table and the plot over one input. */
export function AdvisorWorkspace() {
  const params = useSearchParams();
  const list = useQuery({ queryKey: ['situations'], queryFn: () => api<Situations>('/api/advice') });
  const [situation, setSituation] = useState(params.get('situation') ?? '');
  const like = params.get('like') ?? undefined;
  const [values, setValues] = useState<Record<string, string>>(() => Object.fromEntries([...params.entries()].filter(([k]) => !['situation', 'like', 'sweep'].includes(k))));
  const [sweepSymbol, setSweepSymbol] = useState(params.get('sweep') ?? '');
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const known = list.data?.situations ?? [];
  const current = known.find((s) => s.situation === situation);
  useEffect(() => {
    if (!situation && !like && known.length) setSituation(known.find((s) => s.situation === 'circular tube')?.situation ?? known[0].situation);
  }, [known, situation, like]);
  const inputs = useMemo(() => current?.inputs ?? Object.keys(values), [current, values]);
  const sweep = sweepSymbol && inputs.includes(sweepSymbol) ? sweepSymbol : inputs.find((s) => s.startsWith('Re') || s.startsWith('Ra')) ?? inputs[0];

  const advice = useMutation({
    mutationFn: (body: Record<string, unknown>) => api<Advice>('/api/advice', { body }),
    onError: (e) => setFieldErrors(e instanceof ApiError ? e.fieldErrors() : {}),
    // Arrived "like" a template step's correlation: from now on show that situation's full set of inputs.
    onSuccess: (data) => { if (!situation) setSituation(data.situation); },
  });

  function submit(e?: React.FormEvent) {
    e?.preventDefault();
    const errors: Record<string, string> = {};
    const numbers: Record<string, number> = {};
    for (const s of inputs) {
      const raw = values[s]?.trim() ?? '';
      if (raw === '') continue;
      const n = Number(raw);
      if (!Number.isFinite(n)) errors[`inputs.${s}`] = 'Enter a number, e.g. 3e4';
      else numbers[s] = n;
    }
    if (!Object.keys(numbers).length) errors.form = 'Enter at least one input.';
    setFieldErrors(errors);
    advice.reset();
    if (Object.keys(errors).length) return;
    const x = numbers[sweep];
    const body: Record<string, unknown> = { ...(situation ? { situation } : { like }), inputs: numbers };
    if (x !== undefined && x > 0) body.sweep = { symbol: sweep, from: x / 10, to: x * 10, points: 80, log: true };
    advice.mutate(body);
  }

  const a = advice.data;
  const series: ChartSeries[] = (a?.candidates ?? []).filter((c) => c.series).flatMap((c, k) => [
    { label: c.title, points: c.series!.map((p) => ({ x: p.x, y: p.inside ? p.y : null })), color: k },
    { label: `${c.title} (outside its range)`, points: c.series!.map((p, i, all) => ({ x: p.x, y: !p.inside || all[i - 1]?.inside === false || all[i + 1]?.inside === false ? p.y : null })), color: k, dashed: true, hideInLegend: true },
  ]);
  const point = a && a.sweep ? a.inputs[a.sweep.symbol] : undefined;

  return (
    <div className="grid gap-4 lg:grid-cols-[20rem_1fr]">
      <aside className="panel h-fit space-y-3">
        <form onSubmit={submit} noValidate className="space-y-2" aria-label="Situation and point">
          <label className="block text-sm font-medium">Situation
            <select className="field-input mt-0.5" value={situation} onChange={(e) => { setSituation(e.target.value); advice.reset(); }} aria-label="Situation">
              {!situation && like && <option value="">like {like}</option>}
              {known.map((s) => <option key={`${s.category}|${s.situation}`} value={s.situation}>{s.situation} ({s.correlations})</option>)}
            </select>
          </label>
          {inputs.map((s) => (
            <div key={s}>
              <label htmlFor={`adv-${s}`} className="block text-sm font-medium"><Sym s={s} /></label>
              <input id={`adv-${s}`} inputMode="decimal" className="field-input font-mono" value={values[s] ?? ''} placeholder="leave empty if unknown"
                aria-invalid={Boolean(fieldErrors[`inputs.${s}`])} onChange={(e) => setValues({ ...values, [s]: e.target.value })} />
              {fieldErrors[`inputs.${s}`] && <p className="text-xs text-danger">{fieldErrors[`inputs.${s}`]}</p>}
            </div>
          ))}
          {inputs.length > 0 && (
            <label className="block text-sm">Plot against
              <select className="field-input mt-0.5" value={sweep} onChange={(e) => setSweepSymbol(e.target.value)} aria-label="Plot against">{inputs.map((s) => <option key={s}>{s}</option>)}</select>
              <span className="text-xs text-ink-faint">a tenth to ten times your value, the others held</span>
            </label>
          )}
          {fieldErrors.form && <p role="alert" className="text-sm text-danger">{fieldErrors.form}</p>}
          <button type="submit" className="btn-primary w-full justify-center" disabled={advice.isPending}>{advice.isPending ? 'Evaluating…' : 'Show what applies'}</button>
        </form>
        {advice.isError && !Object.keys(fieldErrors).length && <p role="alert" className="rounded bg-danger-bg px-2 py-1 text-sm text-danger">{advice.error.message}</p>}
        <Caution />
      </aside>
      <div className="space-y-4">
        {!a && <p className="text-sm text-ink-soft">Enter the dimensionless groups you know and press “Show what applies”.</p>}
        {a && (
          <>
            <section className="panel space-y-2" aria-label="Correlations for this situation">
              <div className="flex flex-wrap items-baseline gap-3">
                <h2 className="font-semibold"><Sym s={a.output} /> for {a.situation}</h2>
                {a.spread.inside && <span className="rounded bg-brand-light px-2 py-0.5 text-sm text-brand-dark" data-testid="advice-spread">spread among those in range: {pct(a.spread.inside.rel)} ({formatNumber(a.spread.inside.min, 4)} … {formatNumber(a.spread.inside.max, 4)})</span>}
                {a.spread.all && <span className="text-xs text-ink-soft">all evaluated: {pct(a.spread.all.rel)}</span>}
              </div>
              <table className="table-plain" aria-label="Ranked correlations">
                <thead><tr><th scope="col">#</th><th scope="col">correlation</th><th scope="col">validity at your point</th><th scope="col">{a.output}</th><th scope="col">band</th><th scope="col">evidence</th></tr></thead>
                <tbody>
                  {a.candidates.map((c) => (
                    <tr key={c.slug} data-testid={`advice-${c.slug}`} className={c.status === 'inside' ? '' : 'text-ink-soft'}>
                      <td className="font-mono text-xs">{c.rank}</td>
                      <td><Link className="underline" href={`/correlations/${c.slug}/versions/${c.version}`}>{c.title}</Link><span className="block font-mono text-xs text-ink-faint">{c.slug} v{c.version}</span></td>
                      <td>
                        <span className={`rounded px-1.5 py-0.5 text-xs font-medium ${STATUS[c.status].cls}`} data-testid={`advice-status-${c.slug}`}>{STATUS[c.status].text}</span>
                        {c.breaks.map((b, k) => <span key={k} className="block text-xs text-caution">⚠ {breakText(b)}</span>)}
                        {c.note && c.status !== 'refused' && <span className="block text-xs">{c.note}</span>}
                      </td>
                      <td className="font-mono" data-testid={`advice-value-${c.slug}`}>{c.value === null ? '—' : formatNumber(c.value, 5)}</td>
                      <td className="font-mono text-xs" title={c.band?.basis}>{bandText(c.band)}</td>
                      <td className={`text-xs ${GRADE_CLS[c.grade ?? ''] ?? ''}`}>{c.grade ?? '—'}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              <p className="text-xs text-ink-faint">Ranked: {a.ranking}. The band is each correlation’s published accuracy on its data; the spread is how far the published correlations disagree here.</p>
            </section>
            {a.sweep && series.length > 0 && (
              <section className="panel space-y-2" aria-label="Plot of the correlations">
                <h2 className="font-semibold">Over {a.sweep.symbol}</h2>
                <SeriesChart series={series} logX scaleSwitches xLabel={a.sweep.symbol} yLabel={a.output} limits={point !== undefined ? [{ x: point, label: 'your point' }] : []} height={380}
                  caption={`${a.output} of each correlation over ${a.sweep.symbol}, solid inside its validity ranges and dashed outside`} />
                <p className="text-xs text-ink-faint">Solid where the point lies inside the correlation’s validity ranges, dashed where it does not (an extrapolation). Other inputs held at your values.</p>
              </section>
            )}
          </>
        )}
      </div>
    </div>
  );
}
