'use client';

import { CATEGORIES, CATEGORY_LABELS, type Definition, type ValidityLimit, type Reference } from '@/lib/engine/types';
import { NumberCell } from '@/components/ui/number-cell';


/** Form view of the parts of a definition that are tedious in JSON: description, validity, references. */
export function DefinitionForm({ definition: d, onChange }: { definition: Definition; onChange: (d: Definition) => void }) {
  const set = (patch: Partial<Definition>) => onChange({ ...d, ...patch });
  const symbols = [...d.inputs.map((i) => i.symbol), ...(d.steps ?? []).map((s) => s.symbol), ...d.outputs.map((o) => o.symbol)];
  const limits = d.validity ?? [];
  const setLimit = (k: number, patch: Partial<ValidityLimit>) => set({ validity: limits.map((l, j) => (j === k ? { ...l, ...patch } : l)) });
  const refs = d.references ?? [];
  const setRef = (k: number, patch: Partial<Reference>) => set({ references: refs.map((r, j) => (j === k ? { ...r, ...patch } : r)) });

  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <section className="panel space-y-2" aria-label="Description">
        <h2 className="font-semibold">Description</h2>
        <label className="block text-sm">Title<input className="field-input" value={d.title ?? ''} onChange={(e) => set({ title: e.target.value })} /></label>
        <label className="block text-sm">Summary<textarea className="field-input" rows={3} value={d.summary ?? ''} onChange={(e) => set({ summary: e.target.value })} /></label>
        <div className="grid grid-cols-2 gap-2">
          <label className="block text-sm">Category<select className="field-input" value={d.category} onChange={(e) => set({ category: e.target.value as Definition['category'] })}>{CATEGORIES.map((c) => <option key={c} value={c}>{CATEGORY_LABELS[c]}</option>)}</select></label>
          <label className="block text-sm">Situation<input className="field-input" value={d.situation ?? ''} onChange={(e) => set({ situation: e.target.value })} /></label>
        </div>
        <label className="block text-sm">Property basis<input className="field-input" value={d.propertyBasis ?? ''} onChange={(e) => set({ propertyBasis: e.target.value })} /></label>
        <label className="block text-sm">Notes<textarea className="field-input" rows={3} value={d.notes ?? ''} onChange={(e) => set({ notes: e.target.value })} /></label>
      </section>
      <div className="space-y-4">
        <section className="panel space-y-2" aria-label="Validity ranges">
          <h2 className="font-semibold">Validity ranges</h2>
          <table className="table-plain">
            <thead><tr><th>Symbol</th><th>Min</th><th>Max</th><th>Outside</th><th /></tr></thead>
            <tbody>
              {limits.map((l, k) => (
                <tr key={k}>
                  <td><select aria-label={`limit ${k + 1} symbol`} className="field-input" value={l.symbol} onChange={(e) => setLimit(k, { symbol: e.target.value })}>{symbols.map((s) => <option key={s}>{s}</option>)}</select></td>
                  <td><NumberCell label={`limit ${k + 1} min`} className="w-24" optional value={l.min} onCommit={(v) => setLimit(k, { min: v })} /></td>
                  <td><NumberCell label={`limit ${k + 1} max`} className="w-24" optional value={l.max} onCommit={(v) => setLimit(k, { max: v })} /></td>
                  <td><select aria-label={`limit ${k + 1} action`} className="field-input" value={l.action ?? 'warn'} onChange={(e) => setLimit(k, { action: e.target.value as 'warn' | 'refuse' })}><option value="warn">warn</option><option value="refuse">refuse</option></select></td>
                  <td><button type="button" className="btn-quiet px-2" aria-label={`remove limit ${k + 1}`} onClick={() => set({ validity: limits.filter((_, j) => j !== k) })}>✕</button></td>
                </tr>
              ))}
            </tbody>
          </table>
          <button type="button" className="btn-quiet" onClick={() => set({ validity: [...limits, { symbol: symbols[0], min: 0 }] })}>Add a limit</button>
        </section>
        <section className="panel space-y-2" aria-label="References">
          <h2 className="font-semibold">References</h2>
          {refs.map((r, k) => (
            <div key={k} className="grid grid-cols-[1fr_10rem_9rem_auto] gap-1">
              <input aria-label={`reference ${k + 1} citation`} className="field-input" placeholder="Author (year) title, journal volume:pages" value={r.citation} onChange={(e) => setRef(k, { citation: e.target.value })} />
              <input aria-label={`reference ${k + 1} locator`} className="field-input" placeholder="eq., table, page" value={r.locator ?? ''} onChange={(e) => setRef(k, { locator: e.target.value || undefined })} />
              <input aria-label={`reference ${k + 1} DOI`} className="field-input font-mono" placeholder="10.xxxx/…" value={r.doi ?? ''} onChange={(e) => setRef(k, { doi: e.target.value || undefined })} />
              <button type="button" className="btn-quiet px-2" aria-label={`remove reference ${k + 1}`} onClick={() => set({ references: refs.filter((_, j) => j !== k) })}>✕</button>
            </div>
          ))}
          <button type="button" className="btn-quiet" onClick={() => set({ references: [...refs, { citation: '' }] })}>Add a reference</button>
        </section>
      </div>
    </div>
  );
}
