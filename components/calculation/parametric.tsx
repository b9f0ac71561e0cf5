'use client';

import { useMutation } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { formatNumber } from '@/lib/client/units';
import { caseTableTemplate, download, parseCaseTable, toCsv, type CaseTable } from '@/lib/client/case-table-csv';
import type { TemplateDefinition } from '@/lib/engine/template-types';
import { SeriesChart } from '@/components/charts/series-chart';
import { SavePanel } from './save-panel';
import type { RunAnswer } from './types';

const SHOWN = 200;

/** A table of cases (typed, pasted or uploaded as CSV) run through the template in one request. */
export function ParametricRun({ slug, version, definition, example }: { slug: string; version: number; definition: TemplateDefinition; example?: Record<string, unknown> }) {
  const [text, setText] = useState(() => caseTableTemplate(definition.inputs, example));
  const [table, setTable] = useState<CaseTable | null>(null);
  const [x, setX] = useState(definition.inputs[0].symbol);
  const [y, setY] = useState(definition.outputs.find((o) => o.symbol === 'h')?.symbol ?? definition.outputs[0].symbol);
  const run = useMutation({ mutationFn: (rows: CaseTable['rows']) => api<RunAnswer>(`/api/templates/${slug}/run`, { body: { version, rows } }) });

  function go(e: React.FormEvent) {
    e.preventDefault();
    const t = parseCaseTable(text, definition.inputs);
    setTable(t);
    run.reset();
    if (!t.problems.length) run.mutate(t.rows);
  }
  async function upload(file: File | undefined) {
    if (!file) return;
    if (file.size > 5_000_000) { setTable({ rows: [], problems: ['The file is larger than 5 MB'] }); return; }
    setText(await file.text());
    setTable(null);
  }
  const results = run.data?.results ?? [];
  const rows = table?.rows ?? [];
  const numeric = (v: unknown) => (typeof v === 'number' ? v : (v as { value: number } | undefined)?.value ?? NaN);
  // Plot against what varies: the chosen input, or else the first input that is not the same in every row.
  const varying = definition.inputs.map((i) => i.symbol).filter((s) => new Set(rows.map((r) => numeric(r[s]))).size > 1);
  const xs = varying.includes(x) || varying.length === 0 ? x : varying[0];
  const points = useMemo(() => results.map((r, i) => ({ x: numeric(rows[i]?.[xs]), y: r.outputs?.[y] ?? null, warned: r.warnings.length > 0 })).filter((p) => Number.isFinite(p.x)).sort((a, b) => a.x - b.x), [results, rows, xs, y]);
  const serverIssues = run.error instanceof ApiError ? run.error.details?.issues ?? [] : [];
  const warnedRows = results.filter((r) => r.warnings.length || r.error).length;

  function csv() {
    const outs = definition.outputs.map((o) => o.symbol);
    const header = [...definition.inputs.map((i) => i.symbol), ...outs.map((s) => `${s} [${run.data!.units[s]}]`), 'choices', 'warnings'];
    download(`${slug}-cases.csv`, toCsv([header, ...results.map((r, i) => [
      ...definition.inputs.map((inp) => { const v = rows[i][inp.symbol]; return typeof v === 'number' ? v : `${v.value} ${v.unit}`; }),
      ...outs.map((s) => r.outputs?.[s] ?? ''), Object.entries(r.picked).map(([k, v]) => `${k}: ${v}`).join('; '),
      [r.error?.message, ...r.warnings.map((w) => `${w.step}: ${w.message}`)].filter(Boolean).join(' | '),
    ])]));
  }

  return (
    <div className="space-y-4">
      <form onSubmit={go} noValidate className="panel space-y-2" aria-label="Table of cases">
        <h2 className="font-semibold">Table of cases</h2>
        <p className="text-xs text-ink-soft">One row per case, one column per input named by its symbol; a unit in brackets (<code>T_inf [degC]</code>) overrides the declared unit. Paste, type or upload a CSV file; up to 10,000 rows.</p>
        <label htmlFor="cases-text" className="sr-only">Cases as CSV</label>
        <textarea id="cases-text" className="field-input h-40 font-mono text-xs" value={text} onChange={(e) => { setText(e.target.value); setTable(null); }} spellCheck={false} />
        <div className="flex flex-wrap items-center gap-2">
          <label className="btn-quiet cursor-pointer focus-within:outline focus-within:outline-2 focus-within:outline-brand">Upload CSV<input type="file" accept=".csv,text/csv" className="sr-only" onChange={(e) => upload(e.target.files?.[0])} data-testid="cases-file" /></label>
          <button type="button" className="btn-quiet" onClick={() => download(`${slug}-cases-template.csv`, caseTableTemplate(definition.inputs, example))}>Download a CSV template</button>
          <button type="submit" className="btn-primary" disabled={run.isPending}>{run.isPending ? 'Running…' : 'Run all cases'}</button>
        </div>
        {table && table.problems.length > 0 && (
          <div role="alert" className="rounded bg-danger-bg px-2 py-1 text-sm text-danger">
            <p>Not run: {table.problems.length} problem{table.problems.length === 1 ? '' : 's'} in the table.</p>
            <ul className="list-disc pl-5 text-xs">{table.problems.slice(0, 20).map((p) => <li key={p}>{p}</li>)}</ul>
          </div>
        )}
        {run.isError && (
          <div role="alert" className="rounded bg-danger-bg px-2 py-1 text-sm text-danger">
            <p>{run.error.message}</p>
            <ul className="list-disc pl-5 text-xs">{serverIssues.slice(0, 20).map((i) => <li key={i.path}>{i.path.replace(/^rows\[(\d+)\]\./, (_, n) => `row ${Number(n) + 1}, column `)}: {i.message}</li>)}</ul>
          </div>
        )}
      </form>

      {run.data && (
        <>
          <section className="panel space-y-3" aria-label="Results of the cases">
            <div className="flex flex-wrap items-center gap-3">
              <h2 className="font-semibold">Results of {results.length} case{results.length === 1 ? '' : 's'}</h2>
              <span className={`text-sm ${warnedRows ? 'text-caution' : 'text-ink-soft'}`} data-testid="warned-rows">{warnedRows} with range warnings or refused</span>
              <button type="button" className="btn-quiet ml-auto" onClick={csv}>Download results (CSV)</button>
            </div>
            <div className="flex flex-wrap gap-3 text-sm">
              <label>plot <select className="field-input inline-block w-auto" value={y} onChange={(e) => setY(e.target.value)} aria-label="output to plot">{definition.outputs.map((o) => <option key={o.symbol} value={o.symbol}>{o.symbol}</option>)}</select></label>
              <label>against <select className="field-input inline-block w-auto" value={xs} onChange={(e) => setX(e.target.value)} aria-label="input on the horizontal axis">{definition.inputs.map((i) => <option key={i.symbol} value={i.symbol}>{i.symbol}</option>)}</select></label>
            </div>
            <SeriesChart series={[{ label: `${y} [${run.data.units[y]}]`, points: points.map((p) => ({ x: p.x, y: p.y })) }]} points={points.filter((p) => p.warned && p.y !== null).map((p) => ({ x: p.x, y: p.y!, label: 'range warning' }))}
              xLabel={xs} yLabel={`${y} [${run.data.units[y]}]`} logX={false} scaleSwitches height={280}
              caption={`${y} against ${xs} for every case; marked points carry a range warning (the table below holds the same values)`} />
            <div className="max-h-96 overflow-auto" tabIndex={0} role="region" aria-label="Run results">
              <table className="table-plain" aria-label="Case results">
                <thead><tr><th scope="col">#</th>{definition.inputs.map((i) => <th scope="col" key={i.symbol}>{i.symbol}</th>)}{definition.outputs.map((o) => <th scope="col" key={o.symbol}>{o.symbol} [{run.data!.units[o.symbol]}]</th>)}<th scope="col">choices</th><th scope="col">warnings</th></tr></thead>
                <tbody>
                  {results.slice(0, SHOWN).map((r, i) => (
                    <tr key={i} className={r.warnings.length || r.error ? 'bg-caution-bg' : ''}>
                      <td>{i + 1}</td>
                      {definition.inputs.map((inp) => { const v = rows[i]?.[inp.symbol]; return <td key={inp.symbol} className="font-mono">{typeof v === 'number' ? formatNumber(v, 6) : `${v?.value} ${v?.unit}`}</td>; })}
                      {definition.outputs.map((o) => <td key={o.symbol} className="font-mono">{formatNumber(r.outputs?.[o.symbol], 5)}</td>)}
                      <td className="text-xs">{Object.entries(r.picked).map(([k, v]) => `${k}: ${v}`).join('; ')}</td>
                      <td className="text-xs text-caution">{r.error?.message ?? r.warnings.map((w) => `${w.step}: ${w.symbol}`).join('; ')}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {results.length > SHOWN && <p className="text-xs text-ink-soft">First {SHOWN} of {results.length} rows shown; the CSV holds them all.</p>}
            </div>
          </section>
          <SavePanel defaultTitle={`${definition.title}: ${results.length} cases`} label="Save the table of cases" body={() => ({ template: { slug, version }, rows })} />
        </>
      )}
    </div>
  );
}
