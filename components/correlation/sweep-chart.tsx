'use client';

import { useMutation } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { api } from '@/lib/client/api';
import { boundsOf, isLogRange, typicalValue } from '@/lib/engine/ranges';
import { SeriesChart } from '@/components/charts/series-chart';
import { defaultInputs } from './default-inputs';
import type { VersionDetail } from './types';

const POINTS = 120;

/** Plots one output across one input's validity range, with the check cases and the limits drawn. */
export function SweepChart({ detail }: { detail: VersionDetail }) {
  const d = detail.definition;
  const bounded = d.inputs.find((i) => { const b = boundsOf(d, i.symbol); return b.min !== undefined && b.max !== undefined; }) ?? d.inputs[0];
  const [sweep, setSweep] = useState(bounded.symbol);
  const [output, setOutput] = useState(d.outputs[0].symbol);
  const [range, setRange] = useState(() => defaultRange(sweep));
  const [error, setError] = useState('');

  function defaultRange(symbol: string) {
    const { min, max } = boundsOf(d, symbol);
    const t = typicalValue(d, symbol);
    const lo = min !== undefined && min > 0 ? min : min === 0 && max ? max / 1e4 : t / 10;
    const hi = max ?? t * 10;
    return { from: String(Number(lo.toPrecision(4))), to: String(Number(hi.toPrecision(4))) };
  }

  const evalRows = useMutation({
    mutationFn: async () => {
      const from = Number(range.from);
      const to = Number(range.to);
      if (!Number.isFinite(from) || !Number.isFinite(to) || !(from < to)) throw new Error('Give a range with "from" below "to".');
      const log = isLogRange(from, to);
      const xs = Array.from({ length: POINTS }, (_, k) => (log ? from * (to / from) ** (k / (POINTS - 1)) : from + ((to - from) * k) / (POINTS - 1)));
      const fixed = defaultInputs(d, detail.checkCases);
      const res = await api<{ results: { outputs: Record<string, number> | null }[] }>(`/api/correlations/${detail.slug}/evaluate`, { body: { version: detail.version, rows: xs.map((x) => ({ ...fixed, [sweep]: x })) } });
      return { log, fixed, points: xs.map((x, k) => ({ x, y: res.results[k].outputs?.[output] ?? null })) };
    },
    onError: (e) => setError(e.message),
    onSuccess: () => setError(''),
  });
  const { mutate } = evalRows;
  useEffect(() => { mutate(); }, [sweep, output, mutate]);

  const { min, max } = boundsOf(d, sweep);
  const cases = detail.checkCases
    .filter((c) => typeof c.inputs[sweep] === 'number' && c.expected[output] !== undefined && !c.expectWarnings?.length)
    .map((c) => ({ x: c.inputs[sweep] as number, y: c.expected[output], label: c.label }));

  return (
    <section className="panel space-y-3" aria-label="Plot">
      <div className="flex flex-wrap items-end gap-3">
        <h2 className="mr-auto font-semibold">Plot across the range</h2>
        <label className="text-sm">Output <select className="field-input" value={output} onChange={(e) => setOutput(e.target.value)}>{d.outputs.map((o) => <option key={o.symbol}>{o.symbol}</option>)}</select></label>
        <label className="text-sm">Against <select className="field-input" value={sweep} onChange={(e) => { setSweep(e.target.value); setRange(defaultRange(e.target.value)); }}>{d.inputs.map((i) => <option key={i.symbol}>{i.symbol}</option>)}</select></label>
        <label className="text-sm">from <input className="field-input w-24 font-mono" value={range.from} onChange={(e) => setRange({ ...range, from: e.target.value })} /></label>
        <label className="text-sm">to <input className="field-input w-24 font-mono" value={range.to} onChange={(e) => setRange({ ...range, to: e.target.value })} /></label>
        <button type="button" className="btn-quiet" onClick={() => evalRows.mutate()}>Redraw</button>
      </div>
      {error && <p role="alert" className="text-sm text-danger">{error}</p>}
      {evalRows.data && (
        <>
          <SeriesChart logX={evalRows.data.log} xLabel={sweep} yLabel={output}
            series={[{ label: `${output}, v${detail.version}`, points: evalRows.data.points }]} points={cases}
            limits={[...(min !== undefined ? [{ x: min, label: `min ${sweep}` }] : []), ...(max !== undefined ? [{ x: max, label: `max ${sweep}` }] : [])]} />
          <p className="text-xs text-ink-faint">
            Other inputs held at {Object.entries(evalRows.data.fixed).filter(([s]) => s !== sweep).map(([s, v]) => `${s} = ${Number(v.toPrecision(3))}`).join(', ') || '—'}.
            Check cases are drawn at their own values of the other inputs.
          </p>
        </>
      )}
    </section>
  );
}
