'use client';

import { useEffect, useMemo, useState } from 'react';
import { CATEGORIES, CATEGORY_LABELS, type Definition, type ValidityLimit, type Reference, type InputDef, type ConstantDef, type OutputDef, type StepDef } from '@/lib/engine/types';
import { checkExpression, toTex, FUNCTIONS, BUILTIN_CONSTANTS } from '@/lib/engine/expressions';
import { symbolTex } from '@/lib/engine/tex-symbols';
import { analyseDefinition } from '@/lib/engine/analyse';
import { checkDimensions } from '@/lib/engine/dimensions';
import { checkDefinitionSchema } from '@/lib/engine/schema';
import { NumberCell } from '@/components/ui/number-cell';
import { Tex } from '@/components/ui/tex';

/** Problems of the definition by JSON pointer ("/outputs/0/expression"), from the same checks the server runs. */
function liveIssues(d: Definition): Map<string, string[]> {
  const byPointer = new Map<string, string[]>();
  const add = (pointer: string, message: string) => byPointer.set(pointer, [...(byPointer.get(pointer) ?? []), message]);
  const schema = checkDefinitionSchema(d);
  for (const i of schema) add(i.pointer, i.message);
  if (!schema.length) {
    const { analysed, issues } = analyseDefinition(d);
    for (const i of issues) add(i.pointer, i.message);
    if (analysed) for (const i of checkDimensions(analysed)) add(i.pointer, i.message);
  }
  return byPointer;
}

/** Messages at a pointer and below it (a row shows its fields' problems). */
function messagesAt(issues: Map<string, string[]>, pointer: string, exact = false): string[] {
  return [...issues.entries()].filter(([p]) => (exact ? p === pointer : p === pointer || p.startsWith(`${pointer}/`))).flatMap(([, m]) => m);
}

function FieldMessages({ messages, id }: { messages: string[]; id?: string }) {
  if (!messages.length) return null;
  return <p id={id} className="text-xs text-danger">{messages.join('; ')}</p>;
}

/** The typeset form of `symbol = expression`, or the parser's message. */
function Preview({ symbol, expression, declared }: { symbol: string; expression: string; declared: Set<string> }) {
  const result = useMemo(() => {
    if (!expression.trim()) return { error: 'write the formula' };
    try {
      const checked = checkExpression(expression, declared);
      return { tex: `${symbolTex(symbol || '?')} = ${toTex(checked.node)}` };
    } catch (err) {
      return { error: (err as Error).message };
    }
  }, [symbol, expression, declared]);
  return result.tex
    ? <div className="overflow-x-auto rounded bg-paper-sunk px-2 py-1" data-testid={`preview-${symbol}`}><Tex tex={result.tex} display /></div>
    : <p className="text-xs text-danger">{result.error}</p>;
}

const SYMBOL_HINT = 'letters, digits and _; Greek by name (nu, rho, eps); subscripts after _ (Nu_L, c_p)';

/**
 * The whole definition as a form: description, inputs, constants, steps, outputs with their formulas (each typeset
 * as you type), validity ranges, stated accuracy and references. Every field shows the problems the server's own
 * checks find (schema, expressions, symbols, dimensions), beside it, as you type.
 */
export function DefinitionForm({ definition: d, onChange }: { definition: Definition; onChange: (d: Definition) => void }) {
  const set = (patch: Partial<Definition>) => onChange({ ...d, ...patch });
  const [issues, setIssues] = useState<Map<string, string[]>>(new Map());
  useEffect(() => {
    const t = setTimeout(() => { try { setIssues(liveIssues(d)); } catch { setIssues(new Map()); } }, 250);
    return () => clearTimeout(t);
  }, [d]);
  const at = (pointer: string, exact = false) => messagesAt(issues, pointer, exact);

  const inputs = d.inputs ?? [];
  const constants = d.constants ?? [];
  const steps = d.steps ?? [];
  const outputs = d.outputs ?? [];
  const limits = d.validity ?? [];
  const refs = d.references ?? [];
  const symbols = [...inputs.map((i) => i.symbol), ...constants.map((c) => c.symbol), ...steps.map((s) => s.symbol), ...outputs.map((o) => o.symbol)].filter(Boolean);
  // What a formula may read at each place: inputs, constants and the steps before it.
  const declaredFor = (stepIndex: number) => new Set([...inputs.map((i) => i.symbol), ...constants.map((c) => c.symbol), ...steps.slice(0, stepIndex).map((s) => s.symbol)]);
  const declaredAll = declaredFor(steps.length);

  const setAt = <T,>(list: T[], k: number, patch: Partial<T>) => list.map((x, j) => (j === k ? { ...x, ...patch } : x));
  const move = <T,>(list: T[], k: number, by: number) => { const j = k + by; if (j < 0 || j >= list.length) return list; const c = [...list]; [c[k], c[j]] = [c[j], c[k]]; return c; };
  const total = [...issues.values()].reduce((n, m) => n + m.length, 0);

  return (
    <div className="space-y-4">
      <p role="status" className={`rounded px-3 py-2 text-sm ${total ? 'bg-caution-bg text-caution' : 'bg-ok-bg text-ok'}`} data-testid="form-status">
        {total ? `${total} thing${total === 1 ? '' : 's'} to fix before this definition passes the checks; each is shown beside its field.` : 'The definition passes the schema, formula, symbol and unit checks. Check cases are run when you save and validate.'}
      </p>
      <div className="grid gap-4 lg:grid-cols-2">
        <section className="panel space-y-2" aria-labelledby="form-description">
          <h2 id="form-description" className="font-semibold">Description</h2>
          <label className="block text-sm">Title<input className="field-input" placeholder="e.g. Laminar flow in rectangular ducts, fully developed" value={d.title ?? ''} aria-invalid={at('/title').length > 0} onChange={(e) => set({ title: e.target.value })} /></label>
          <FieldMessages messages={at('/title')} />
          <label className="block text-sm">Summary<textarea className="field-input" rows={2} placeholder="What it gives, for which situation, in one or two sentences" value={d.summary ?? ''} aria-invalid={at('/summary').length > 0} onChange={(e) => set({ summary: e.target.value })} /></label>
          <FieldMessages messages={at('/summary')} />
          <div className="grid grid-cols-2 gap-2">
            <label className="block text-sm">Category<select className="field-input" value={d.category} onChange={(e) => set({ category: e.target.value as Definition['category'] })}>{CATEGORIES.map((c) => <option key={c} value={c}>{CATEGORY_LABELS[c]}</option>)}</select></label>
            <label className="block text-sm">Situation<input className="field-input" placeholder="e.g. rectangular duct" value={d.situation ?? ''} aria-invalid={at('/situation').length > 0} onChange={(e) => set({ situation: e.target.value })} /></label>
          </div>
          <FieldMessages messages={at('/situation')} />
          <label className="block text-sm">Property basis<input className="field-input" placeholder="e.g. film temperature; bulk mean temperature" value={d.propertyBasis ?? ''} onChange={(e) => set({ propertyBasis: e.target.value || undefined })} /></label>
          <label className="block text-sm">Notes<textarea className="field-input" rows={3} placeholder="Corrections not included, how the published figure was read, limits of use" value={d.notes ?? ''} onChange={(e) => set({ notes: e.target.value || undefined })} /></label>
        </section>

        <section className="panel space-y-2" aria-labelledby="form-accuracy">
          <h2 id="form-accuracy" className="font-semibold">Stated accuracy</h2>
          <p className="text-xs text-ink-soft">As the source states it: ±20 % on its data is 20. Zero marks an exact solution of the model the definition states. Leave empty if the source states none.</p>
          <div className="grid grid-cols-[8rem_1fr] gap-2">
            <label className="flex flex-col text-sm">± %<NumberCell label="stated accuracy, ± %" className="w-28" optional value={d.accuracy ? Number((d.accuracy.rel * 100).toPrecision(6)) : undefined}
              onCommit={(n) => set({ accuracy: n === undefined ? undefined : { ...(d.accuracy ?? { basis: '' }), rel: n / 100 } })} /></label>
            <input aria-label="where the accuracy is stated" className="field-input" placeholder="where it is stated, e.g. ±10 % on the data for 0.5 < Pr < 2000 (ref. 1, p. 361)" value={d.accuracy?.basis ?? ''} disabled={!d.accuracy}
              onChange={(e) => d.accuracy && set({ accuracy: { ...d.accuracy, basis: e.target.value } })} />
          </div>
          <FieldMessages messages={at('/accuracy')} />

          <h2 id="form-references" className="pt-2 font-semibold">References</h2>
          {refs.map((r, k) => (
            <div key={k} className="space-y-1">
              <div className="grid grid-cols-[1fr_9rem_8rem_auto] gap-1">
                <input aria-label={`reference ${k + 1} citation`} className="field-input" placeholder="Author (year) title, journal volume:pages" value={r.citation} aria-invalid={at(`/references/${k}`).length > 0} onChange={(e) => set({ references: setAt<Reference>(refs, k, { citation: e.target.value }) })} />
                <input aria-label={`reference ${k + 1} locator`} className="field-input" placeholder="eq., table, page" value={r.locator ?? ''} onChange={(e) => set({ references: setAt<Reference>(refs, k, { locator: e.target.value || undefined }) })} />
                <input aria-label={`reference ${k + 1} DOI`} className="field-input font-mono" placeholder="10.xxxx/…" value={r.doi ?? ''} onChange={(e) => set({ references: setAt<Reference>(refs, k, { doi: e.target.value || undefined }) })} />
                <button type="button" className="btn-quiet px-2" aria-label={`remove reference ${k + 1}`} onClick={() => set({ references: refs.filter((_, j) => j !== k) })}>✕</button>
              </div>
              <FieldMessages messages={at(`/references/${k}`)} />
            </div>
          ))}
          <FieldMessages messages={at('/references', true)} />
          <button type="button" className="btn-quiet" onClick={() => set({ references: [...refs, { citation: '' }] })}>Add a reference</button>
        </section>
      </div>

      <section className="panel space-y-2" aria-labelledby="form-inputs">
        <h2 id="form-inputs" className="font-semibold">Inputs</h2>
        <p className="text-xs text-ink-soft">Symbol: {SYMBOL_HINT}. Unit: SI as mathjs writes it (m, W/(m^2 K), Pa s, K) or 1 for a dimensionless group.</p>
        <table className="table-plain">
          <thead><tr><th scope="col">Symbol</th><th scope="col">Typeset</th><th scope="col">Name</th><th scope="col">Unit</th><th scope="col">Description</th><th scope="col"><span className="sr-only">Order and removal</span></th></tr></thead>
          <tbody>
            {inputs.map((i, k) => (
              <tr key={k}>
                <td><input aria-label={`input ${k + 1} symbol`} className="field-input w-28 font-mono" placeholder="Re_D" value={i.symbol} aria-invalid={at(`/inputs/${k}/symbol`).length > 0} onChange={(e) => set({ inputs: setAt<InputDef>(inputs, k, { symbol: e.target.value.trim() }) })} /></td>
                <td>{i.symbol && <Tex tex={symbolTex(i.symbol)} />}</td>
                <td><input aria-label={`input ${k + 1} name`} className="field-input" placeholder="Reynolds number on the diameter" value={i.name} onChange={(e) => set({ inputs: setAt<InputDef>(inputs, k, { name: e.target.value }) })} /></td>
                <td><input aria-label={`input ${k + 1} unit`} className="field-input w-28 font-mono" placeholder="1" value={i.unit} aria-invalid={at(`/inputs/${k}/unit`).length > 0} onChange={(e) => set({ inputs: setAt<InputDef>(inputs, k, { unit: e.target.value.trim() }) })} /></td>
                <td><input aria-label={`input ${k + 1} description`} className="field-input" placeholder="how it is formed, e.g. V D / ν" value={i.description ?? ''} onChange={(e) => set({ inputs: setAt<InputDef>(inputs, k, { description: e.target.value || undefined }) })} />
                  <FieldMessages messages={at(`/inputs/${k}`)} /></td>
                <td className="whitespace-nowrap">
                  <button type="button" className="btn-quiet px-2" aria-label={`move input ${k + 1} up`} disabled={k === 0} onClick={() => set({ inputs: move(inputs, k, -1) })}>↑</button>
                  <button type="button" className="btn-quiet px-2" aria-label={`remove input ${k + 1}`} onClick={() => set({ inputs: inputs.filter((_, j) => j !== k) })}>✕</button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <FieldMessages messages={at('/inputs', true)} />
        <button type="button" className="btn-quiet" onClick={() => set({ inputs: [...inputs, { symbol: '', name: '', unit: '1' }] })}>Add an input</button>
      </section>

      <section className="panel space-y-2" aria-labelledby="form-constants">
        <h2 id="form-constants" className="font-semibold">Constants</h2>
        <p className="text-xs text-ink-soft">Coefficients with a name and a unit, so a reviewer sees them in one table and a new version’s changes show as a change of value.</p>
        {constants.length > 0 && (
          <table className="table-plain">
            <thead><tr><th scope="col">Symbol</th><th scope="col">Name</th><th scope="col">Value</th><th scope="col">Unit</th><th scope="col"><span className="sr-only">Removal</span></th></tr></thead>
            <tbody>{constants.map((c, k) => (
              <tr key={k}>
                <td><input aria-label={`constant ${k + 1} symbol`} className="field-input w-28 font-mono" value={c.symbol} onChange={(e) => set({ constants: setAt<ConstantDef>(constants, k, { symbol: e.target.value.trim() }) })} /></td>
                <td><input aria-label={`constant ${k + 1} name`} className="field-input" value={c.name} onChange={(e) => set({ constants: setAt<ConstantDef>(constants, k, { name: e.target.value }) })} /></td>
                <td><NumberCell key={`${k}-${c.value}`} label={`constant ${k + 1} value`} value={c.value} onCommit={(n) => n !== undefined && set({ constants: setAt<ConstantDef>(constants, k, { value: n }) })} /></td>
                <td><input aria-label={`constant ${k + 1} unit`} className="field-input w-28 font-mono" value={c.unit} onChange={(e) => set({ constants: setAt<ConstantDef>(constants, k, { unit: e.target.value.trim() }) })} />
                  <FieldMessages messages={at(`/constants/${k}`)} /></td>
                <td><button type="button" className="btn-quiet px-2" aria-label={`remove constant ${k + 1}`} onClick={() => set({ constants: constants.filter((_, j) => j !== k) })}>✕</button></td>
              </tr>
            ))}</tbody>
          </table>
        )}
        <button type="button" className="btn-quiet" onClick={() => set({ constants: [...constants, { symbol: '', name: '', value: 0, unit: '1' }] })}>Add a constant</button>
      </section>

      <section className="panel space-y-3" aria-labelledby="form-steps">
        <h2 id="form-steps" className="font-semibold">Steps</h2>
        <p className="text-xs text-ink-soft">Intermediate quantities computed in order before the outputs: a formula, or an implicit equation solved for its symbol between two bounds (Brent’s method). A formula reads the inputs, the constants and the steps above it. Functions: {Object.keys(FUNCTIONS).join(', ')}; constants {Object.keys(BUILTIN_CONSTANTS).join(', ')}; a ? b : c for branches.</p>
        {steps.map((s, k) => (
          <div key={k} className="space-y-1 rounded border border-line p-2">
            <div className="flex flex-wrap items-end gap-2">
              <label className="flex flex-col text-sm">Kind<select className="field-input" value={s.kind} disabled={s.kind === 'table'} onChange={(e) => {
                const kind = e.target.value as 'expression' | 'solve';
                const base = { symbol: s.symbol, name: s.name, unit: s.unit };
                set({ steps: steps.map((x, j) => (j === k ? (kind === 'solve' ? { ...base, kind, residual: s.kind === 'expression' ? s.expression : '', bracket: [0, 1] } : { ...base, kind, expression: s.kind === 'solve' ? s.residual : '' }) : x)) as StepDef[] });
              }}><option value="expression">formula</option><option value="solve">implicit equation</option>{s.kind === 'table' && <option value="table">table look-up</option>}</select></label>
              <label className="flex flex-col text-sm">Symbol<input className="field-input w-28 font-mono" value={s.symbol} aria-invalid={at(`/steps/${k}/symbol`).length > 0} onChange={(e) => set({ steps: setAt<StepDef>(steps, k, { symbol: e.target.value.trim() }) })} /></label>
              <label className="flex flex-col text-sm">Name<input className="field-input w-64" value={s.name} onChange={(e) => set({ steps: setAt<StepDef>(steps, k, { name: e.target.value }) })} /></label>
              <label className="flex flex-col text-sm">Unit<input className="field-input w-28 font-mono" value={s.unit} onChange={(e) => set({ steps: setAt<StepDef>(steps, k, { unit: e.target.value.trim() }) })} /></label>
              <span className="ml-auto flex gap-1">
                <button type="button" className="btn-quiet px-2" aria-label={`move step ${k + 1} up`} disabled={k === 0} onClick={() => set({ steps: move(steps, k, -1) })}>↑</button>
                <button type="button" className="btn-quiet px-2" aria-label={`remove step ${k + 1}`} onClick={() => set({ steps: steps.filter((_, j) => j !== k) })}>✕</button>
              </span>
            </div>
            {s.kind === 'expression' && (<>
              <label className="block text-sm">Formula for {s.symbol || 'the step'}<input className="field-input font-mono" placeholder="e.g. (0.790 * log(Re_D) - 1.64)^(-2)" value={s.expression} aria-invalid={at(`/steps/${k}/expression`).length > 0} onChange={(e) => set({ steps: setAt<StepDef>(steps, k, { expression: e.target.value } as Partial<StepDef>) })} /></label>
              <Preview symbol={s.symbol} expression={s.expression} declared={declaredFor(k)} />
            </>)}
            {s.kind === 'solve' && (<>
              <label className="block text-sm">Residual, zero at the solution<input className="field-input font-mono" placeholder={`e.g. 1/sqrt(${s.symbol || 'f'}) + 2*log10(eps_D/3.7 + 2.51/(Re_D*sqrt(${s.symbol || 'f'})))`} value={s.residual} aria-invalid={at(`/steps/${k}/residual`).length > 0} onChange={(e) => set({ steps: setAt<StepDef>(steps, k, { residual: e.target.value } as Partial<StepDef>) })} /></label>
              <div className="flex gap-2">
                <label className="flex flex-col text-sm">Lower bound<input className="field-input w-40 font-mono" value={String(s.bracket[0])} onChange={(e) => { const v = e.target.value; set({ steps: setAt<StepDef>(steps, k, { bracket: [Number.isFinite(Number(v)) && v.trim() !== '' ? Number(v) : v, s.bracket[1]] } as Partial<StepDef>) }); }} /></label>
                <label className="flex flex-col text-sm">Upper bound<input className="field-input w-40 font-mono" value={String(s.bracket[1])} onChange={(e) => { const v = e.target.value; set({ steps: setAt<StepDef>(steps, k, { bracket: [s.bracket[0], Number.isFinite(Number(v)) && v.trim() !== '' ? Number(v) : v] } as Partial<StepDef>) }); }} /></label>
              </div>
              <Preview symbol={`0`} expression={s.residual} declared={new Set([...declaredFor(k), s.symbol])} />
            </>)}
            {s.kind === 'table' && <p className="text-xs text-ink-soft">A look-up in the table “{s.table}” (column {s.column} at {s.at}): edit tables in the definition JSON.</p>}
            <FieldMessages messages={at(`/steps/${k}`)} />
          </div>
        ))}
        <div className="flex gap-2">
          <button type="button" className="btn-quiet" onClick={() => set({ steps: [...steps, { kind: 'expression', symbol: '', name: '', unit: '1', expression: '' }] })}>Add a formula step</button>
          <button type="button" className="btn-quiet" onClick={() => set({ steps: [...steps, { kind: 'solve', symbol: '', name: '', unit: '1', residual: '', bracket: [0, 1] }] })}>Add an implicit equation</button>
        </div>
      </section>

      <section className="panel space-y-3" aria-labelledby="form-outputs">
        <h2 id="form-outputs" className="font-semibold">Outputs</h2>
        {outputs.map((o, k) => (
          <div key={k} className="space-y-1 rounded border border-line p-2">
            <div className="flex flex-wrap items-end gap-2">
              <label className="flex flex-col text-sm">Symbol<input className="field-input w-28 font-mono" placeholder="Nu_D" value={o.symbol} aria-invalid={at(`/outputs/${k}/symbol`).length > 0} onChange={(e) => set({ outputs: setAt<OutputDef>(outputs, k, { symbol: e.target.value.trim() }) })} /></label>
              <label className="flex flex-col text-sm">Name<input className="field-input w-64" placeholder="average Nusselt number" value={o.name} onChange={(e) => set({ outputs: setAt<OutputDef>(outputs, k, { name: e.target.value }) })} /></label>
              <label className="flex flex-col text-sm">Unit<input className="field-input w-28 font-mono" value={o.unit} aria-invalid={at(`/outputs/${k}/unit`).length > 0} onChange={(e) => set({ outputs: setAt<OutputDef>(outputs, k, { unit: e.target.value.trim() }) })} /></label>
              <button type="button" className="btn-quiet ml-auto px-2" aria-label={`remove output ${k + 1}`} onClick={() => set({ outputs: outputs.filter((_, j) => j !== k) })}>✕</button>
            </div>
            <label className="block text-sm">Formula for {o.symbol || 'the output'}<input className="field-input font-mono" placeholder="e.g. 0.3 + 0.62 * Re_D^(1/2) * Pr^(1/3)" value={o.expression} aria-invalid={at(`/outputs/${k}/expression`).length > 0} onChange={(e) => set({ outputs: setAt<OutputDef>(outputs, k, { expression: e.target.value }) })} /></label>
            <Preview symbol={o.symbol} expression={o.expression} declared={declaredAll} />
            <FieldMessages messages={at(`/outputs/${k}`)} />
          </div>
        ))}
        <FieldMessages messages={at('/outputs', true)} />
        <button type="button" className="btn-quiet" onClick={() => set({ outputs: [...outputs, { symbol: '', name: '', unit: '1', expression: '' }] })}>Add an output</button>
      </section>

      <section className="panel space-y-2" aria-labelledby="form-validity">
        <h2 id="form-validity" className="font-semibold">Validity ranges</h2>
        <p className="text-xs text-ink-soft">As published. Outside a range the result is computed with a warning, or refused when the limit is marked so. Empty min or max: no bound on that side.</p>
        <table className="table-plain">
          <thead><tr><th scope="col">Symbol</th><th scope="col">Min</th><th scope="col">Max</th><th scope="col">Outside</th><th scope="col">Note</th><th scope="col"><span className="sr-only">Removal</span></th></tr></thead>
          <tbody>
            {limits.map((l, k) => (
              <tr key={k}>
                <td><select aria-label={`limit ${k + 1} symbol`} className="field-input" value={l.symbol} onChange={(e) => set({ validity: setAt<ValidityLimit>(limits, k, { symbol: e.target.value }) })}>{[...new Set([l.symbol, ...symbols])].map((s) => <option key={s}>{s}</option>)}</select></td>
                <td><NumberCell key={`${k}-min-${l.min}`} label={`limit ${k + 1} min`} className="w-24" optional value={l.min} onCommit={(v) => set({ validity: setAt<ValidityLimit>(limits, k, { min: v }) })} /></td>
                <td><NumberCell key={`${k}-max-${l.max}`} label={`limit ${k + 1} max`} className="w-24" optional value={l.max} onCommit={(v) => set({ validity: setAt<ValidityLimit>(limits, k, { max: v }) })} /></td>
                <td><select aria-label={`limit ${k + 1} action`} className="field-input" value={l.action ?? 'warn'} onChange={(e) => set({ validity: setAt<ValidityLimit>(limits, k, { action: e.target.value as 'warn' | 'refuse' }) })}><option value="warn">warn</option><option value="refuse">refuse</option></select></td>
                <td><input aria-label={`limit ${k + 1} note`} className="field-input" placeholder="where the range is stated" value={l.note ?? ''} onChange={(e) => set({ validity: setAt<ValidityLimit>(limits, k, { note: e.target.value || undefined }) })} /><FieldMessages messages={at(`/validity/${k}`)} /></td>
                <td><button type="button" className="btn-quiet px-2" aria-label={`remove limit ${k + 1}`} onClick={() => set({ validity: limits.filter((_, j) => j !== k) })}>✕</button></td>
              </tr>
            ))}
          </tbody>
        </table>
        <button type="button" className="btn-quiet" disabled={!symbols.length} onClick={() => set({ validity: [...limits, { symbol: symbols[0] }] })}>Add a range</button>
      </section>
    </div>
  );
}
