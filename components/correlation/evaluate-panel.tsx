'use client';

import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { formatNumber, isDimensionless, unitChoices } from '@/lib/client/units';
import { defaultInputs } from './default-inputs';
import { Caution } from '@/components/ui/caution';
import { bandText } from '@/lib/client/bands';
import type { VersionDetail } from './types';
import type { ApiAnswer } from '@/lib/client/typed';

type Answer = ApiAnswer<'/api/correlations/{slug}/evaluate', 'post'>;

export function EvaluatePanel({ detail }: { detail: VersionDetail }) {
  const d = detail.definition;
  const [values, setValues] = useState<Record<string, string>>(() => Object.fromEntries(Object.entries(defaultInputs(d, detail.checkCases)).map(([k, v]) => [k, String(v)])));
  const [units, setUnits] = useState<Record<string, string>>(() => Object.fromEntries(d.inputs.map((i) => [i.symbol, i.unit])));
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const run = useMutation({
    mutationFn: (inputs: Record<string, unknown>) => api<Answer>(`/api/correlations/${detail.slug}/evaluate`, { body: { version: detail.version, inputs } }),
    onError: (e) => setFieldErrors(e instanceof ApiError ? e.fieldErrors() : {}),
  });

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const errors: Record<string, string> = {};
    const inputs: Record<string, unknown> = {};
    for (const i of d.inputs) {
      const raw = values[i.symbol]?.trim() ?? '';
      const n = Number(raw);
      if (raw === '' || !Number.isFinite(n)) { errors[`inputs.${i.symbol}`] = raw === '' ? 'Enter a value' : 'Enter a number, e.g. 2.5e4'; continue; }
      inputs[i.symbol] = units[i.symbol] === i.unit ? n : { value: n, unit: units[i.symbol] };
    }
    setFieldErrors(errors);
    // Never leave an earlier result beside inputs it does not belong to.
    run.reset();
    if (Object.keys(errors).length === 0) run.mutate(inputs);
  }

  const warnings = run.data?.warnings ?? [];
  const inputWarning = (s: string) => warnings.find((w) => w.symbol === s);
  const other = warnings.filter((w) => !d.inputs.some((i) => i.symbol === w.symbol));

  return (
    <aside className="panel h-fit space-y-3 lg:sticky lg:top-4" aria-label="Evaluate">
      <h2 className="font-semibold">Evaluate version {detail.version}</h2>
      <form onSubmit={submit} noValidate className="space-y-2">
        {d.inputs.map((i) => {
          const err = fieldErrors[`inputs.${i.symbol}`] ?? fieldErrors[`inputs.${i.symbol}.unit`] ?? fieldErrors[`inputs.${i.symbol}.value`];
          const warn = inputWarning(i.symbol);
          const choices = unitChoices(i.unit);
          return (
            <div key={i.symbol}>
              <label htmlFor={`in-${i.symbol}`} className="block text-sm font-medium">{i.symbol} <span className="font-normal text-ink-faint">— {i.name}</span></label>
              <div className="mt-0.5 flex gap-1">
                <input id={`in-${i.symbol}`} inputMode="decimal" className="field-input font-mono" aria-invalid={Boolean(err) || Boolean(warn)}
                  value={values[i.symbol]} onChange={(e) => setValues({ ...values, [i.symbol]: e.target.value })} />
                {isDimensionless(i.unit) ? <span className="w-24 self-center text-xs text-ink-faint">dimensionless</span> : (
                  <select aria-label={`${i.symbol} unit`} className="field-input w-28" value={units[i.symbol]} onChange={(e) => setUnits({ ...units, [i.symbol]: e.target.value })}>
                    {choices.map((u) => <option key={u} value={u}>{u}</option>)}
                  </select>
                )}
              </div>
              {err && <p className="text-xs text-danger">{err}</p>}
              {warn && <p role="alert" className="mt-1 rounded bg-caution-bg px-2 py-1 text-xs font-medium text-caution">⚠ {warn.message}</p>}
            </div>
          );
        })}
        <button type="submit" className="btn-primary w-full justify-center" disabled={run.isPending}>{run.isPending ? 'Evaluating…' : 'Evaluate'}</button>
      </form>
      {run.isError && !Object.keys(fieldErrors).length && <p role="alert" className="rounded bg-danger-bg px-2 py-1 text-sm text-danger">{run.error.message}</p>}
      {run.data && (
        <div className={`space-y-2 ${warnings.length ? 'rounded border-2 border-caution-line p-2' : ''}`} aria-live="polite">
          {warnings.length > 0 && <p role="status" className="text-sm font-medium text-caution">⚠ Outside the published validity range: an extrapolation, not a validated value.</p>}
          <table className="table-plain">
            <tbody>
              {d.outputs.map((o) => {
                const band = run.data.bands?.[o.symbol];
                return (
                  <tr key={o.symbol}>
                    <th className="w-1/3 normal-case">{o.symbol}</th>
                    <td className="font-mono text-base" data-testid={`out-${o.symbol}`}>{formatNumber(run.data.outputs?.[o.symbol] ?? NaN, 6)}</td>
                    <td className="text-xs text-ink-soft">{isDimensionless(o.unit) ? '' : o.unit}</td>
                    <td className="text-xs text-ink-soft" data-testid={`band-${o.symbol}`} title={band?.basis}>{bandText(band)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {Object.values(run.data.bands ?? {}).some(Boolean) && (
            <p className="text-xs text-ink-faint">± is the stated accuracy of this correlation on its data — {Object.values(run.data.bands ?? {}).find(Boolean)!.basis} — not a guarantee for your case.</p>
          )}
          {other.map((w, k) => <p key={k} role="alert" className="rounded bg-caution-bg px-2 py-1 text-xs text-caution">⚠ {w.message}</p>)}
          <p className="text-xs text-ink-faint">Version {run.data.version}, content hash {run.data.contentHash?.slice(0, 12) ?? 'not frozen'}.</p>
        </div>
      )}
      <Caution />
    </aside>
  );
}

