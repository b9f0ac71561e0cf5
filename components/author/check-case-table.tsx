'use client';

import { useEffect, useState } from 'react';
import { checkCaseTemplate, parseCheckCaseCsv, CSV_MAX_BYTES, CSV_MAX_ROWS, type CsvRow } from '@/lib/client/check-case-csv';
import { download } from '@/lib/client/case-table-csv';
import { checkCheckCaseSchema } from '@/lib/engine/schema';
import { SOURCE_KINDS, type CheckCase, type Definition, type SourceKind } from '@/lib/engine/types';
import type { ValidationReport } from '@/lib/engine/validate';
import { NumberCell } from '@/components/ui/number-cell';
import { Sym } from '@/components/ui/sym';
import { EvidenceDocument } from './evidence-document';

/** What each kind of source means, in a word, for the select's options. */
const KIND_HINT: Record<SourceKind, string> = {
  published: 'published — handbook, paper or standard, with a locator',
  'independent-solution': 'independent solution — the physics solved another way',
  'standard-formulation': 'standard formulation — e.g. IAPWS through a library',
  'cross-check': 'cross-check — another correlation, tolerance from both accuracies',
  limit: 'limit — a limiting case the formula must reach',
  transcription: 'transcription — the formula re-typed (counts for nothing)',
  memory: 'memory — a value recalled, not looked up',
  'common-practice': 'common practice — a fact of the trade',
};

/** A check case still being typed: inputs and expected values may be missing until the author fills them. */
type Editing = Omit<CheckCase, 'inputs' | 'expected'> & { inputs: Record<string, CheckCase['inputs'][string] | undefined>; expected: Record<string, number | undefined> };

function blank(definition: Definition): Editing {
  return {
    label: '', inputs: Object.fromEntries(definition.inputs.map((i) => [i.symbol, undefined])), expected: {},
    tolerance: { rel: undefined }, source: { kind: 'published', citation: '' },
  };
}

/** Problems of one row, in words, before anything is sent: missing values, then the schema's own messages. */
function rowProblems(c: Editing, definition: Definition): string[] {
  const out: string[] = [];
  if (!c.label.trim()) out.push('give the case a label');
  const missing = definition.inputs.filter((i) => c.inputs[i.symbol] === undefined).map((i) => i.symbol);
  if (missing.length) out.push(`enter ${missing.join(', ')}`);
  const expected = Object.values(c.expected).filter((v) => v !== undefined);
  if (!expected.length && !c.expectWarnings?.length) out.push('enter at least one expected value (or the symbols whose warning it expects)');
  if (c.tolerance.rel === undefined && c.tolerance.abs === undefined) out.push('give a relative or absolute tolerance');
  if (!c.source.citation.trim()) out.push('cite where the value comes from');
  if (c.source.kind === 'published' && !c.source.locator?.trim()) out.push('a published value needs its locator (table, equation, page)');
  if (out.length) return out;
  return checkCheckCaseSchema(c).map((i) => `${i.pointer === '/' ? 'case' : i.pointer.slice(1).replace(/\//g, ' ')}: ${i.message}`);
}

const inputNumber = (v: Editing['inputs'][string]) => (v === undefined ? undefined : typeof v === 'number' ? v : v.value);

/**
 * The check cases of a draft: typed in rows (add, duplicate, delete), pasted from a spreadsheet, or uploaded as CSV
 * with a preview; a CSV template for this correlation can be downloaded. `onPending` says whether a pasted or
 * uploaded table is still waiting to be added or discarded (the editor will not save past it).
 */
export function CheckCaseTable({ definition, cases, onChange, report, onPending }: {
  definition: Definition; cases: CheckCase[]; onChange: (c: CheckCase[]) => void; report: ValidationReport | null; onPending?: (pending: boolean) => void;
}) {
  const [preview, setPreview] = useState<{ name: string; rows: CsvRow[]; fileErrors: string[] } | null>(null);
  const [paste, setPaste] = useState('');
  useEffect(() => { onPending?.(preview !== null); }, [preview, onPending]);
  const rows = cases as unknown as Editing[];
  const set = (k: number, patch: Partial<Editing>) => onChange(rows.map((c, j) => (j === k ? { ...c, ...patch } : c)) as unknown as CheckCase[]);
  const outputs = definition.outputs;

  async function onFile(file: File | undefined) {
    if (!file) return;
    if (file.size > CSV_MAX_BYTES) { setPreview({ name: file.name, rows: [], fileErrors: [`The file is larger than ${CSV_MAX_BYTES / 1e6} MB.`] }); return; }
    setPreview({ name: file.name, ...parseCheckCaseCsv(await file.text(), definition) });
  }
  const good = preview?.rows.filter((r) => r.checkCase).map((r) => r.checkCase!) ?? [];
  const bad = preview?.rows.filter((r) => !r.checkCase) ?? [];

  return (
    <div className="space-y-4">
      <section className="panel space-y-3" aria-label="Check cases">
        <div className="flex flex-wrap items-center gap-2">
          <h2 className="mr-auto font-semibold">Check cases ({cases.length})</h2>
          <button type="button" className="btn-primary" onClick={() => onChange([...rows, blank(definition)] as unknown as CheckCase[])}>Add a check case</button>
        </div>
        <p className="text-xs text-ink-soft">
          Each case is evidence only if it could disagree with the formula: a published value with its locator, an independent solution,
          a limit, another correlation within both stated accuracies. A value re-typed from the formula is a transcription and counts for nothing.
          Inputs in their declared units; expected values in the outputs’ units.
        </p>
        {rows.length === 0 ? <p className="text-sm text-ink-soft">No check cases yet. Add one, paste rows from a spreadsheet or upload a CSV file below; a version needs at least one to pass validation.</p> : (
          <div className="overflow-x-auto">
            <table className="table-plain" aria-label="Check cases of this draft">
              <thead>
                <tr>
                  <th scope="col">#</th><th scope="col">Label</th>
                  {definition.inputs.map((i) => <th key={i.symbol} scope="col"><Sym s={i.symbol} /> <span className="font-normal">{['1', ''].includes(i.unit) ? '' : `[${i.unit}]`}</span></th>)}
                  {outputs.map((o) => <th key={o.symbol} scope="col">expected <Sym s={o.symbol} /></th>)}
                  <th scope="col">Tolerance (rel / abs)</th><th scope="col">Result</th><th scope="col"><span className="sr-only">Actions</span></th>
                </tr>
              </thead>
              {rows.map((c, k) => {
                const result = report?.cases[k];
                const problems = rowProblems(c, definition);
                const name = c.label.trim() || `case ${k + 1}`;
                return (
                  <tbody key={k} className={result && !result.passed ? 'bg-danger-bg' : ''}>
                    <tr>
                      <td className="font-mono text-xs">{k + 1}</td>
                      <td><input aria-label={`case ${k + 1} label`} className="field-input w-48" placeholder="what the case checks" value={c.label} onChange={(e) => set(k, { label: e.target.value })} /></td>
                      {definition.inputs.map((i) => {
                        const v = c.inputs[i.symbol];
                        const unit = v !== undefined && typeof v === 'object' ? v.unit : null;
                        return (
                          <td key={i.symbol}>
                            <NumberCell key={`${k}-${i.symbol}-${inputNumber(v)}`} label={`${name} input ${i.symbol}`} className="w-24" optional value={inputNumber(v)}
                              onCommit={(n) => set(k, { inputs: { ...c.inputs, [i.symbol]: n === undefined ? undefined : unit ? { value: n, unit } : n } })} />
                            {unit && <span className="text-xs text-ink-soft">{unit}</span>}
                          </td>
                        );
                      })}
                      {outputs.map((o) => (
                        <td key={o.symbol}>
                          <NumberCell key={`${k}-${o.symbol}-${c.expected[o.symbol]}`} label={`${name} expected ${o.symbol}`} className="w-28" optional value={c.expected[o.symbol]}
                            onCommit={(n) => { const expected = { ...c.expected }; if (n === undefined) delete expected[o.symbol]; else expected[o.symbol] = n; set(k, { expected }); }} />
                        </td>
                      ))}
                      <td>
                        <div className="flex gap-1">
                          <NumberCell key={`${k}-rel-${c.tolerance.rel}`} label={`${name} relative tolerance`} className="w-20" optional value={c.tolerance.rel} onCommit={(n) => set(k, { tolerance: { ...c.tolerance, rel: n } })} />
                          <NumberCell key={`${k}-abs-${c.tolerance.abs}`} label={`${name} absolute tolerance`} className="w-20" optional value={c.tolerance.abs} onCommit={(n) => set(k, { tolerance: { ...c.tolerance, abs: n } })} />
                        </div>
                      </td>
                      <td className="text-xs">{result ? (result.passed ? <span className="text-ok">reproduced</span> : <span className="font-medium text-danger">not reproduced</span>) : '—'}</td>
                      <td className="whitespace-nowrap">
                        <button type="button" className="btn-quiet px-2 py-1 text-xs" aria-label={`Duplicate ${name}`} onClick={() => onChange([...rows.slice(0, k + 1), { ...structuredClone(c), label: `${c.label} (copy)` }, ...rows.slice(k + 1)] as unknown as CheckCase[])}>Duplicate</button>
                        <button type="button" className="btn-quiet px-2 py-1 text-xs" aria-label={`Delete ${name}`} onClick={() => onChange(rows.filter((_, j) => j !== k) as unknown as CheckCase[])}>Delete</button>
                      </td>
                    </tr>
                    <tr>
                      <td />
                      <td colSpan={definition.inputs.length + outputs.length + 4}>
                        <div className="grid gap-1 md:grid-cols-[14rem_1fr_12rem_12rem]">
                          <select aria-label={`${name} kind of source`} className="field-input" value={c.source.kind} onChange={(e) => set(k, { source: { ...c.source, kind: e.target.value as SourceKind } })}>
                            {SOURCE_KINDS.map((s) => <option key={s} value={s}>{KIND_HINT[s]}</option>)}
                          </select>
                          <input aria-label={`${name} citation`} className="field-input" placeholder="where the value comes from: author (year) title, journal volume:pages" value={c.source.citation} onChange={(e) => set(k, { source: { ...c.source, citation: e.target.value } })} />
                          <input aria-label={`${name} locator`} className="field-input" placeholder="table, equation, figure, page" value={c.source.locator ?? ''} onChange={(e) => set(k, { source: { ...c.source, locator: e.target.value || undefined } })} />
                          <input aria-label={`${name} symbols whose warning it expects`} className="field-input font-mono" placeholder="expects warning for (symbols)" value={(c.expectWarnings ?? []).join(' ')}
                            onChange={(e) => { const w = e.target.value.split(/[\s,]+/).filter(Boolean); set(k, { expectWarnings: w.length ? w : undefined }); }} />
                        </div>
                        <div className="mt-1"><EvidenceDocument label={name} value={c.source.attachment} onChange={(attachment) => set(k, { source: { ...c.source, attachment } })} /></div>
                        <input aria-label={`${name} why this tolerance`} className="field-input mt-1" placeholder="why this tolerance (e.g. the stated accuracies of both correlations)" value={c.tolerance.why ?? ''} onChange={(e) => set(k, { tolerance: { ...c.tolerance, why: e.target.value || undefined } })} />
                        {problems.length > 0 && <p className="mt-1 text-xs text-danger" data-testid={`case-problems-${k}`}>To finish this case: {problems.join('; ')}.</p>}
                        {result && !result.passed && <p className="mt-1 text-xs text-danger">{result.problems.length ? result.problems.join('; ') : 'The formula does not reproduce this value within the tolerance.'}</p>}
                      </td>
                    </tr>
                  </tbody>
                );
              })}
            </table>
          </div>
        )}
      </section>

      <section className="panel space-y-3" aria-label="Paste or upload check cases">
        <h2 className="font-semibold">Paste or upload many at once</h2>
        <p className="text-xs text-ink-soft">
          Columns: <code>label</code>; one per input ({definition.inputs.map((i) => i.symbol).join(', ')}; a unit may follow in brackets, e.g. <code>T [degC]</code>);
          {' '}{outputs.map((o) => <code key={o.symbol}>expected:{o.symbol} </code>)}; <code>rel</code> and/or <code>abs</code>; <code>why</code>; <code>source_kind</code> ({SOURCE_KINDS.join(', ')});
          {' '}<code>citation</code>; <code>locator</code> (required for published); <code>expect_warnings</code>. Comma- or tab-separated, with the header row. At most {CSV_MAX_ROWS} rows and {CSV_MAX_BYTES / 1e6} MB.
        </p>
        <div className="flex flex-wrap items-center gap-2">
          <button type="button" className="btn-quiet" onClick={() => download(`check-cases-${definition.title.toLowerCase().replace(/[^a-z0-9]+/g, '-').slice(0, 40)}.csv`, checkCaseTemplate(definition))}>Download a CSV template for this correlation</button>
          <label className="btn-quiet cursor-pointer focus-within:outline focus-within:outline-2 focus-within:outline-offset-2 focus-within:outline-brand">
            Choose a CSV file
            <input type="file" accept=".csv,text/csv,text/tab-separated-values" className="sr-only" aria-label="CSV file of check cases" onChange={(e) => { void onFile(e.target.files?.[0]); e.target.value = ''; }} />
          </label>
        </div>
        <label className="block text-sm">Or paste rows copied from a spreadsheet, header row first
          <textarea className="field-input font-mono text-xs" rows={4} value={paste} onChange={(e) => setPaste(e.target.value)} placeholder={`label\t${definition.inputs.map((i) => i.symbol).join('\t')}\t${outputs.map((o) => `expected:${o.symbol}`).join('\t')}\trel\tsource_kind\tcitation\tlocator`} />
        </label>
        <button type="button" className="btn-quiet" disabled={!paste.trim()} onClick={() => { setPreview({ name: 'the pasted rows', ...parseCheckCaseCsv(paste, definition) }); }}>Preview the pasted rows</button>
        {preview && (
          <section className="space-y-2 rounded border border-caution-line bg-caution-bg/40 p-3" aria-label="Preview of the rows to add">
            <p className="text-sm font-medium" role="status">Preview of {preview.name}: {good.length} valid row{good.length === 1 ? '' : 's'}, {bad.length} with errors. Nothing is added until you choose below.</p>
            {preview.fileErrors.map((e, k) => <p key={k} role="alert" className="text-sm text-danger">{e}</p>)}
            {preview.rows.length > 0 && (
              <table className="table-plain">
                <thead><tr><th scope="col">Line</th><th scope="col">Label</th><th scope="col">Inputs</th><th scope="col">Expected</th><th scope="col">Problems</th></tr></thead>
                <tbody>{preview.rows.map((r) => (
                  <tr key={r.line} className={r.checkCase ? '' : 'bg-danger-bg'}>
                    <td>{r.line}</td><td>{r.checkCase?.label ?? '—'}</td>
                    <td className="font-mono text-xs">{r.checkCase ? Object.entries(r.checkCase.inputs).map(([s, v]) => `${s} = ${typeof v === 'number' ? v : `${v.value} ${v.unit}`}`).join(', ') : ''}</td>
                    <td className="font-mono text-xs">{r.checkCase ? Object.entries(r.checkCase.expected).map(([s, v]) => `${s} = ${v}`).join(', ') : ''}</td>
                    <td className="text-xs text-danger">{r.errors.join('; ')}</td>
                  </tr>
                ))}</tbody>
              </table>
            )}
            <div className="flex flex-wrap gap-2">
              <button type="button" className="btn-primary" disabled={good.length === 0 || bad.length > 0 || preview.fileErrors.length > 0} onClick={() => { onChange([...cases, ...good]); setPreview(null); setPaste(''); }}>Add {good.length} row{good.length === 1 ? '' : 's'}</button>
              <button type="button" className="btn-quiet" disabled={good.length === 0 || bad.length > 0 || preview.fileErrors.length > 0} onClick={() => { onChange(good); setPreview(null); setPaste(''); }}>Replace all check cases</button>
              <button type="button" className="btn-quiet" onClick={() => setPreview(null)}>Discard</button>
            </div>
            {bad.length > 0 && <p className="text-xs text-ink-soft">Fix the rows with errors and try again; nothing has been changed.</p>}
          </section>
        )}
      </section>
    </div>
  );
}
