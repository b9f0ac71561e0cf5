'use client';

import { useMutation, useQueries, useQuery } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { api } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { Caution } from '@/components/ui/caution';
import { SeriesChart, splitByValidity } from '@/components/charts/series-chart';
import { boundsOf, typicalValue } from '@/lib/engine/ranges';
import { formatNumber } from '@/lib/client/units';
import type { VersionDetail } from '@/components/correlation/types';
import type { Comparison } from '@/lib/engine/compare';

interface Item { slug: string; title: string; situation: string; latestApprovedVersion: number | null }

export function CompareView() {
  const list = useQuery({ queryKey: ['library-all'], queryFn: () => api<{ items: Item[] }>('/api/correlations?pageSize=200&sort=title') });
  const situations = useMemo(() => [...new Set((list.data?.items ?? []).filter((i) => i.latestApprovedVersion).map((i) => i.situation))].sort(), [list.data]);
  const [situation, setSituation] = useState('cylinder in cross-flow');
  const [picked, setPicked] = useState<string[]>([]);
  const candidates = (list.data?.items ?? []).filter((i) => i.situation === situation && i.latestApprovedVersion);
  const details = useQueries({
    queries: picked.map((slug) => {
      const item = candidates.find((c) => c.slug === slug);
      return { queryKey: ['version', slug, item?.latestApprovedVersion], enabled: Boolean(item), queryFn: () => api<VersionDetail>(`/api/correlations/${slug}/versions/${item!.latestApprovedVersion}`) };
    }),
  });
  const defs = details.map((d) => d.data).filter((d): d is VersionDetail => Boolean(d));
  const commonInputs = defs.length ? defs[0].definition.inputs.map((i) => i.symbol).filter((s) => defs.every((d) => d.definition.inputs.some((i) => i.symbol === s))) : [];
  const commonOutputs = defs.length ? defs[0].definition.outputs.map((o) => o.symbol).filter((s) => defs.every((d) => d.definition.outputs.some((o) => o.symbol === s))) : [];
  const allInputs = [...new Set(defs.flatMap((d) => d.definition.inputs.map((i) => i.symbol)))];
  const [sweep, setSweep] = useState('');
  const [range, setRange] = useState({ from: '', to: '' });
  const [fixed, setFixed] = useState<Record<string, string>>({});
  const sweepSymbol = commonInputs.includes(sweep) ? sweep : commonInputs[0] ?? '';
  const output = commonOutputs[0] ?? '';

  const run = useMutation({
    mutationFn: () => {
      const fixedNums: Record<string, number> = {};
      for (const s of allInputs.filter((x) => x !== sweepSymbol)) {
        const raw = fixed[s] ?? String(Number(typicalValue(defs.find((d) => d.definition.inputs.some((i) => i.symbol === s))!.definition, s).toPrecision(3)));
        const n = Number(raw);
        if (!Number.isFinite(n)) throw new Error(`${s}: enter a number`);
        fixedNums[s] = n;
      }
      const from = range.from.trim() ? Number(range.from) : undefined;
      const to = range.to.trim() ? Number(range.to) : undefined;
      return api<Comparison>('/api/compare', { body: { items: defs.map((d) => ({ slug: d.slug, version: d.version })), sweep: sweepSymbol, output, fixed: fixedNums, ...(from !== undefined ? { from } : {}), ...(to !== undefined ? { to } : {}), points: 150 } });
    },
  });

  return (
    <QueryState query={list}>
      {() => (
        <div className="grid gap-5 lg:grid-cols-[320px_1fr]">
          <aside className="panel h-fit space-y-3" aria-label="Choose correlations">
            <label className="block text-sm font-medium">Situation
              <select className="field-input mt-1" value={situation} onChange={(e) => { setSituation(e.target.value); setPicked([]); run.reset(); }}>
                {situations.map((s) => <option key={s}>{s}</option>)}
              </select>
            </label>
            <fieldset className="space-y-1">
              <legend className="text-sm font-medium">Correlations</legend>
              {candidates.map((c) => (
                <label key={c.slug} className="flex items-start gap-2 text-sm">
                  <input type="checkbox" className="mt-1" checked={picked.includes(c.slug)} onChange={(e) => { setPicked(e.target.checked ? [...picked, c.slug] : picked.filter((s) => s !== c.slug)); run.reset(); }} />
                  <span>{c.title} <span className="font-mono text-xs text-ink-faint">v{c.latestApprovedVersion}</span></span>
                </label>
              ))}
            </fieldset>
            {defs.length > 0 && (
              <div className="space-y-2 border-t border-line pt-3">
                {commonInputs.length === 0 || !output ? <p className="text-sm text-danger">These correlations share no input or output: pick correlations of one kind.</p> : (
                  <>
                    <label className="block text-sm">Sweep <select className="field-input" value={sweepSymbol} onChange={(e) => setSweep(e.target.value)}>{commonInputs.map((s) => <option key={s}>{s}</option>)}</select></label>
                    <p className="text-sm">Output <code>{output}</code></p>
                    <div className="flex gap-2">
                      <label className="text-sm">from <input className="field-input font-mono" placeholder="overlap" value={range.from} onChange={(e) => setRange({ ...range, from: e.target.value })} /></label>
                      <label className="text-sm">to <input className="field-input font-mono" placeholder="overlap" value={range.to} onChange={(e) => setRange({ ...range, to: e.target.value })} /></label>
                    </div>
                    {allInputs.filter((s) => s !== sweepSymbol).map((s) => (
                      <label key={s} className="block text-sm">{s} held at
                        <input className="field-input font-mono" value={fixed[s] ?? String(Number(typicalValue(defs.find((d) => d.definition.inputs.some((i) => i.symbol === s))!.definition, s).toPrecision(3)))} onChange={(e) => setFixed({ ...fixed, [s]: e.target.value })} />
                      </label>
                    ))}
                    <button type="button" className="btn-primary w-full justify-center" disabled={run.isPending || defs.length < picked.length} onClick={() => run.mutate()}>{defs.length < picked.length ? 'Loading the definitions…' : 'Plot'}</button>
                  </>
                )}
              </div>
            )}
          </aside>
          <section className="panel space-y-3" aria-label="Comparison">
            {!run.data && !run.isError && <p className="text-sm text-ink-faint">Choose two or more correlations and press Plot.</p>}
            {run.isError && <p role="alert" className="text-sm text-danger">{run.error.message}</p>}
            {run.data && (
              <>
                <SeriesChart height={380} logX={run.data.scale === 'log'} scaleSwitches xDomain={[run.data.from, run.data.to]} xLabel={run.data.sweep} yLabel={run.data.output}
                  caption={`${run.data.output} of ${run.data.series.length} correlations against ${run.data.sweep}; each curve is solid inside its own validity range and dashed outside it`}
                  series={run.data.series.flatMap((s, k) => splitByValidity(s.label, s.points, k))} />
                <ul className="space-y-1 text-sm">
                  {run.data.differences.map((d, k) => {
                    const l = run.data!.largest[k];
                    const pct = (x: number) => `${x >= 0 ? '+' : '−'}${formatNumber(Math.abs(x) * 100, 3)} %`;
                    return (
                      <li key={d.label}>
                        {d.label}, against {run.data!.series[0].label}: {d.kind === 'no-overlap' ? 'the two are nowhere both inside their validity ranges here.'
                          : d.kind === 'none' ? 'the same values, where both are valid.'
                          : d.kind === 'uniform' ? <>uniformly <strong>{pct(d.value!)}</strong> where both are valid.</>
                          : <>from {pct(d.min!)} to {pct(d.max!)} where both are valid; largest <strong>{formatNumber(l.relDiff * 100, 3)} %</strong> at {run.data!.sweep} = {formatNumber(l.at, 4)}.</>}
                      </li>
                    );
                  })}
                </ul>
                {defs.map((d) => { const b = boundsOf(d.definition, run.data!.sweep); return <p key={d.slug} className="text-xs text-ink-soft">{d.definition.title}: {run.data!.sweep} valid {b.min ?? '−∞'} … {b.max ?? '∞'}</p>; })}
              </>
            )}
            <Caution />
          </section>
        </div>
      )}
    </QueryState>
  );
}
