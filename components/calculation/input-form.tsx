'use client';

import { isDimensionless, unitChoices } from '@/lib/client/units';
import type { InputDef } from '@/lib/engine/types';
import { Sym } from '@/components/ui/sym';

export interface InputState { values: Record<string, string>; units: Record<string, string> }

export function initialInputs(inputs: InputDef[], example?: Record<string, unknown>): InputState {
  const values: Record<string, string> = {};
  const units: Record<string, string> = {};
  for (const i of inputs) {
    const raw = example?.[i.symbol];
    if (raw && typeof raw === 'object' && 'value' in raw) { const q = raw as { value: number; unit?: string }; values[i.symbol] = String(q.value); units[i.symbol] = q.unit ?? i.unit; }
    else { values[i.symbol] = typeof raw === 'number' ? String(raw) : ''; units[i.symbol] = i.unit; }
  }
  return { values, units };
}

/** Inputs as the API takes them; field errors keyed "inputs.<symbol>" for values that are not numbers. */
export function readForm(inputs: InputDef[], state: InputState): { inputs: Record<string, unknown>; errors: Record<string, string> } {
  const out: Record<string, unknown> = {};
  const errors: Record<string, string> = {};
  for (const i of inputs) {
    const raw = state.values[i.symbol]?.trim() ?? '';
    const n = Number(raw);
    if (raw === '' || !Number.isFinite(n)) { errors[`inputs.${i.symbol}`] = raw === '' ? 'Enter a value' : `"${raw}" is not a number (e.g. 2.5e4)`; continue; }
    out[i.symbol] = state.units[i.symbol] === i.unit ? n : { value: n, unit: state.units[i.symbol] };
  }
  return { inputs: out, errors };
}

/** One labelled row per input: value, unit picker (converted on the server), its error beside it. */
export function InputForm({ inputs, state, onChange, errors }: { inputs: InputDef[]; state: InputState; onChange: (s: InputState) => void; errors: Record<string, string> }) {
  return (
    <div className="space-y-2">
      {inputs.map((i) => {
        const err = errors[`inputs.${i.symbol}`] ?? errors[`inputs.${i.symbol}.unit`] ?? errors[`inputs.${i.symbol}.value`];
        const id = `in-${i.symbol}`;
        return (
          <div key={i.symbol}>
            <label htmlFor={id} className="flex items-baseline gap-2 text-sm font-medium"><Sym s={i.symbol} /> <span className="font-normal text-ink-soft">{i.name}</span></label>
            <div className="mt-0.5 flex gap-1">
              <input id={id} name={i.symbol} inputMode="decimal" className="field-input font-mono" aria-invalid={Boolean(err)} aria-describedby={err ? `${id}-err` : undefined}
                value={state.values[i.symbol] ?? ''} onChange={(e) => onChange({ ...state, values: { ...state.values, [i.symbol]: e.target.value } })} />
              {isDimensionless(i.unit) ? <span className="w-28 self-center text-xs text-ink-soft">dimensionless</span> : (
                <select aria-label={`${i.symbol} unit`} className="field-input w-28" value={state.units[i.symbol]} onChange={(e) => onChange({ ...state, units: { ...state.units, [i.symbol]: e.target.value } })}>
                  {unitChoices(i.unit).map((u) => <option key={u} value={u}>{u}</option>)}
                </select>
              )}
            </div>
            {err && <p id={`${id}-err`} className="text-xs text-danger">{err}</p>}
          </div>
        );
      })}
    </div>
  );
}
