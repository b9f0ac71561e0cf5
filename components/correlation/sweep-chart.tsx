'use client';

import { useMutation } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { api } from '@/lib/client/api';
import { boundsOf, isLogRange, typicalValue } from '@/lib/engine/ranges';
import { SeriesChart, splitByValidity } from '@/components/charts/series-chart';
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
      const res = await api<{ results: { outputs: Record<string, number> | null; warnings: unknown[] }[] }>(`/api/correlations/${detail.slug}/evaluate`, { body: { version: detail.version, rows: xs.map((x) => ({ ...fixed, [sweep]: x })) } });
      const points = xs.map((x, k) => ({ x, y: res.results[k].outputs?.[output] ?? null, warned: (res.results[k].warnings?.length ?? 0) > 0 || !res.results[k].outputs }));
      const ys = points.map((p) => p.y).filter((y): y is number => y !== null && y > 0);
      return { log, fixed, from, to, output, sweep, points, logY: ys.length > 1 && Math.max(...ys) / Math.min(...ys) >= 100 };
    },
    onError: (e) => setError(e.message),
    onSuccess: () => setError(''),
  });
  const { mutate } = evalRows;
  useEffect(() => { mutate(); }, [sweep, output, mutate]);

  const { min, max } = boundsOf(d, sweep);
  // Check cases are drawn only where they belong: at the values the other inputs are held at (to 1e-6).
  const drawn = evalRows.data;
  const atHeld = (c: (typeof detail.checkCases)[number]) => d.inputs.every((i) => i.symbol === sweep || (typeof c.inputs[i.symbol] === 'number' && drawn && Math.abs((c.inputs[i.symbol] as number) - drawn.fixed[i.symbol]) <= 1e-6 * Math.max(1, Math.abs(drawn.fixed[i.symbol]))));
  const usable = detail.checkCases.filter((c) => typeof c.inputs[sweep] === 'number' && c.expected[drawn?.output ?? output] !== undefined && !c.expectWarnings?.length);
  const cases = usable.filter(atHeld).map((c) => ({ x: c.inputs[sweep] as number, y: c.expected[drawn?.output ?? output], label: c.label }));
  const elsewhere = usable.length - cases.length;

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
      {drawn && (
        <>
          <SeriesChart key={`${drawn.sweep}-${drawn.output}-${drawn.from}-${drawn.to}`} logX={drawn.log} logY={drawn.logY} scaleSwitches xDomain={[drawn.from, drawn.to]} xLabel={drawn.sweep} yLabel={drawn.output}
            series={splitByValidity(`${drawn.output}, v${detail.version}`, drawn.points, 0)} points={cases}
            caption={`${drawn.output} of version ${detail.version} against ${drawn.sweep} from ${drawn.from} to ${drawn.to}; dashed where an input is outside the validity range`}
            limits={[...(min !== undefined ? [{ x: min, label: `min ${drawn.sweep}` }] : []), ...(max !== undefined ? [{ x: max, label: `max ${drawn.sweep}` }] : [])]} />
          <p className="text-xs text-ink-soft">
            Other inputs held at {Object.entries(drawn.fixed).filter(([sym]) => sym !== drawn.sweep).map(([sym, v]) => `${sym} = ${Number(v.toPrecision(3))}`).join(', ') || '—'}.
            {' '}{cases.length ? `${cases.length} check case${cases.length === 1 ? '' : 's'} at these values drawn as diamonds.` : ''}
            {elsewhere > 0 ? ` ${elsewhere} other check case${elsewhere === 1 ? ' is' : 's are'} at other values of the other inputs and not drawn (see the report below).` : ''}
          </p>
        </>
      )}
    </section>
  );
}
