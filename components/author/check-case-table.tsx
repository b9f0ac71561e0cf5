'use client';

import { useState } from 'react';
import { parseCheckCaseCsv, CSV_MAX_BYTES, CSV_MAX_ROWS, type CsvRow } from '@/lib/client/check-case-csv';
import type { CheckCase, Definition } from '@/lib/engine/types';
import type { ValidationReport } from '@/lib/engine/validate';
import { NumberCell } from '@/components/ui/number-cell';

const showInputs = (c: CheckCase) => Object.entries(c.inputs).map(([k, v]) => `${k}=${typeof v === 'number' ? v : `${v.value} ${v.unit}`}`).join(', ');

/** Editable list of check cases with CSV upload: the file is previewed row by row before anything changes. */
export function CheckCaseTable({ definition, cases, onChange, report }: { definition: Definition; cases: CheckCase[]; onChange: (c: CheckCase[]) => void; report: ValidationReport | null }) {
  const [preview, setPreview] = useState<{ name: string; rows: CsvRow[]; fileErrors: string[] } | null>(null);
  const outputs = definition.outputs.map((o) => o.symbol);

  async function onFile(file: File | undefined) {
    if (!file) return;
    if (file.size > CSV_MAX_BYTES) { setPreview({ name: file.name, rows: [], fileErrors: [`The file is larger than ${CSV_MAX_BYTES / 1e6} MB.`] }); return; }
    setPreview({ name: file.name, ...parseCheckCaseCsv(await file.text(), definition) });
  }
  const good = preview?.rows.filter((r) => r.checkCase).map((r) => r.checkCase!) ?? [];
  const bad = preview?.rows.filter((r) => !r.checkCase) ?? [];
  const setExpected = (k: number, symbol: string, n: number | undefined) => {
    onChange(cases.map((c, j) => {
      if (j !== k) return c;
      const expected = { ...c.expected };
      if (n === undefined) delete expected[symbol]; else expected[symbol] = n;
      return { ...c, expected };
    }));
  };

  return (
    <div className="space-y-4">
      <section className="panel space-y-2" aria-label="Upload check cases">
        <h2 className="font-semibold">Upload check cases (CSV)</h2>
        <p className="text-xs text-ink-soft">
          Columns: <code>label</code>; one per input ({definition.inputs.map((i) => i.symbol).join(', ')}; a unit may follow in brackets, e.g. <code>T [degC]</code>);
          {' '}{outputs.map((o) => <code key={o}>expected:{o} </code>)}; <code>rel</code> and/or <code>abs</code> tolerance; <code>why</code>; <code>source_kind</code> (published, numerical, common-practice, memory);
          {' '}<code>citation</code>; <code>locator</code> (required for published); <code>expect_warnings</code>. At most {CSV_MAX_ROWS} rows and {CSV_MAX_BYTES / 1e6} MB.
        </p>
        <label className="inline-flex items-center gap-2 text-sm"><span className="btn-quiet">Choose a CSV file</span>
          <input type="file" accept=".csv,text/csv" className="sr-only" aria-label="CSV file of check cases" onChange={(e) => { void onFile(e.target.files?.[0]); e.target.value = ''; }} />
        </label>
        {preview && (
          <section className="space-y-2 rounded border border-line p-3" aria-label="CSV preview">
            <p className="text-sm font-medium">Preview of {preview.name}: {good.length} valid row{good.length === 1 ? '' : 's'}, {bad.length} with errors</p>
            {preview.fileErrors.map((e, k) => <p key={k} role="alert" className="text-sm text-danger">{e}</p>)}
            {preview.rows.length > 0 && (
              <table className="table-plain">
                <thead><tr><th>Line</th><th>Label</th><th>Inputs</th><th>Expected</th><th>Problems</th></tr></thead>
                <tbody>{preview.rows.map((r) => (
                  <tr key={r.line} className={r.checkCase ? '' : 'bg-danger-bg'}>
                    <td>{r.line}</td><td>{r.checkCase?.label ?? '—'}</td><td className="font-mono text-xs">{r.checkCase ? showInputs(r.checkCase) : ''}</td>
                    <td className="font-mono text-xs">{r.checkCase ? JSON.stringify(r.checkCase.expected) : ''}</td><td className="text-xs text-danger">{r.errors.join('; ')}</td>
                  </tr>
                ))}</tbody>
              </table>
            )}
            <div className="flex gap-2">
              <button type="button" className="btn-primary" disabled={good.length === 0 || bad.length > 0 || preview.fileErrors.length > 0} onClick={() => { onChange([...cases, ...good]); setPreview(null); }}>Add {good.length} row{good.length === 1 ? '' : 's'}</button>
              <button type="button" className="btn-quiet" disabled={good.length === 0 || bad.length > 0 || preview.fileErrors.length > 0} onClick={() => { onChange(good); setPreview(null); }}>Replace all check cases</button>
              <button type="button" className="btn-quiet" onClick={() => setPreview(null)}>Discard</button>
            </div>
            {bad.length > 0 && <p className="text-xs text-ink-soft">Fix the rows with errors in the file and upload it again; nothing has been changed.</p>}
          </section>
        )}
      </section>
      <section className="panel" aria-label="Check cases">
        <h2 className="mb-2 font-semibold">Check cases</h2>
        {cases.length === 0 ? <p className="text-sm text-ink-faint">No check cases yet. A version needs at least one to pass validation.</p> : (
          <table className="table-plain">
            <thead><tr><th>Label</th><th>Inputs</th>{outputs.map((o) => <th key={o}>expected {o}</th>)}<th>Tolerance</th><th>Source</th><th>Result</th><th /></tr></thead>
            <tbody>{cases.map((c, k) => {
              const r = report?.cases[k];
              return (
                <tr key={`${k}-${c.label}`} className={r && !r.passed ? 'bg-danger-bg' : ''}>
                  <td>{c.label}{c.expectWarnings?.length ? <div className="text-xs text-caution">expects warning: {c.expectWarnings.join(', ')}</div> : null}</td>
                  <td className="font-mono text-xs">{showInputs(c)}</td>
                  {outputs.map((o) => <td key={o}><NumberCell label={`${c.label} expected ${o}`} optional value={c.expected[o]} onCommit={(v) => setExpected(k, o, v)} /></td>)}
                  <td className="text-xs">{c.tolerance.rel !== undefined && `rel ${c.tolerance.rel}`}{c.tolerance.abs !== undefined && ` abs ${c.tolerance.abs}`}</td>
                  <td className="text-xs">{c.source.kind}</td>
                  <td className="text-xs">{r ? (r.passed ? <span className="text-ok">pass</span> : <span className="text-danger">fail</span>) : '—'}</td>
                  <td><button type="button" className="btn-quiet px-2" aria-label={`remove check case ${c.label}`} onClick={() => onChange(cases.filter((_, j) => j !== k))}>✕</button></td>
                </tr>
              );
            })}</tbody>
          </table>
        )}
      </section>
    </div>
  );
}
