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
import { Sym } from '@/components/ui/sym';

type Answer = ApiAnswer<'/api/correlations/{slug}/evaluate', 'post'>;

export function EvaluatePanel({ detail }: { detail: VersionDetail }) {
  const d = detail.definition;
  const [values, setValues] = useState<Record<string, string>>(() => Object.fromEntries(Object.entries(defaultInputs(d, detail.checkCases)).map(([k, v]) => [k, String(v)])));
  const [units, setUnits] = useState<Record<string, string>>(() => Object.fromEntries(d.inputs.map((i) => [i.symbol, i.unit])));
  const [outUnits, setOutUnits] = useState<Record<string, string>>(() => Object.fromEntries(d.outputs.map((o) => [o.symbol, o.unit])));
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const run = useMutation({
    mutationFn: (inputs: Record<string, unknown>) => {
      const outputUnits = Object.fromEntries(d.outputs.filter((o) => outUnits[o.symbol] !== o.unit).map((o) => [o.symbol, outUnits[o.symbol]]));
      return api<Answer>(`/api/correlations/${detail.slug}/evaluate`, { body: { version: detail.version, inputs, ...(Object.keys(outputUnits).length ? { outputUnits } : {}) } });
    },
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

  // A refused result (a hard limit, a formula that gives no number) still says which inputs are out of range.
  const refusedWarnings = run.error instanceof ApiError && Array.isArray(run.error.details?.warnings) ? (run.error.details!.warnings as { symbol: string; message: string }[]) : [];
  const warnings = run.data?.warnings ?? refusedWarnings;
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
          const describedBy = [err && `in-${i.symbol}-err`, warn && `in-${i.symbol}-warn`].filter(Boolean).join(' ') || undefined;
          return (
            <div key={i.symbol}>
              <label htmlFor={`in-${i.symbol}`} className="block text-sm font-medium"><Sym s={i.symbol} /> <span className="font-normal text-ink-soft">— {i.name}</span></label>
              <div className="mt-0.5 flex gap-1">
                <input id={`in-${i.symbol}`} inputMode="decimal" className={`field-input font-mono ${warn && !err ? 'border-caution-line bg-caution-bg' : ''}`} aria-invalid={Boolean(err)} aria-describedby={describedBy}
                  value={values[i.symbol]} onChange={(e) => { setValues({ ...values, [i.symbol]: e.target.value }); }} />
                {isDimensionless(i.unit) ? <span className="w-24 self-center text-xs text-ink-soft">dimensionless</span> : (
                  <select aria-label={`${i.symbol} unit`} className="field-input w-28" value={units[i.symbol]} onChange={(e) => setUnits({ ...units, [i.symbol]: e.target.value })}>
                    {choices.map((u) => <option key={u} value={u}>{u}</option>)}
                  </select>
                )}
              </div>
              {err && <p id={`in-${i.symbol}-err`} className="text-xs text-danger">{err}</p>}
              {warn && <p id={`in-${i.symbol}-warn`} className="mt-1 rounded bg-caution-bg px-2 py-1 text-xs font-medium text-caution">⚠ {warn.message}</p>}
            </div>
          );
        })}
        <button type="submit" className="btn-primary w-full justify-center" disabled={run.isPending}>{run.isPending ? 'Evaluating…' : 'Evaluate'}</button>
      </form>
      {run.isError && !Object.keys(fieldErrors).length && <p role="alert" className="rounded bg-danger-bg px-2 py-1 text-sm text-danger">{run.error.message}</p>}
      {run.data && (
        <div className={`space-y-2 ${warnings.length ? 'rounded border-2 border-caution-line bg-caution-bg/40 p-2' : ''}`} aria-live="polite" data-testid="evaluation-result">
          {warnings.length > 0
            ? <p className="text-sm font-semibold text-caution">⚠ Extrapolated: {warnings.length === 1 ? 'an input is' : 'inputs are'} outside the published validity range. This is not a validated value.</p>
            : <p className="text-sm text-ok">Inside the published validity ranges.</p>}
          <table className="table-plain">
            <caption className="sr-only">Results of version {run.data.version}</caption>
            <tbody>
              {d.outputs.map((o) => {
                const band = run.data.bands?.[o.symbol];
                const unit = run.data.units?.[o.symbol] ?? o.unit;
                return (
                  <tr key={o.symbol}>
                    <th scope="row" className="w-1/4 normal-case"><Sym s={o.symbol} /></th>
                    <td className={`font-mono text-base ${warnings.length ? 'text-caution' : ''}`} data-testid={`out-${o.symbol}`}>{formatNumber(run.data.outputs?.[o.symbol] ?? NaN, 6)}{warnings.length ? ' *' : ''}</td>
                    <td className="text-xs text-ink-soft">{isDimensionless(unit) ? '' : unit}</td>
                    <td className="text-xs text-ink-soft" data-testid={`band-${o.symbol}`} title={band?.basis}>{bandText(band)}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {warnings.length > 0 && <p className="text-xs text-caution">* computed outside the validity range: {warnings.map((w) => w.message).join('; ')}.</p>}
          {Object.values(run.data.bands ?? {}).some(Boolean) && (
            <p className="text-xs text-ink-soft">± is the stated accuracy of this correlation on its data — {Object.values(run.data.bands ?? {}).find(Boolean)!.basis} — not a guarantee for your case.</p>
          )}
          {other.map((w, k) => <p key={k} role="alert" className="rounded bg-caution-bg px-2 py-1 text-xs text-caution">⚠ {w.message}</p>)}
          <p className="text-xs text-ink-soft">Version {run.data.version}, content hash {run.data.contentHash?.slice(0, 12) ?? 'not frozen'}.</p>
        </div>
      )}
      {d.outputs.some((o) => unitChoices(o.unit).length > 1) && (
        <fieldset className="space-y-1 text-xs">
          <legend className="font-medium">Results in</legend>
          {d.outputs.filter((o) => unitChoices(o.unit).length > 1).map((o) => (
            <label key={o.symbol} className="mr-3 inline-flex items-center gap-1"><Sym s={o.symbol} />
              <select aria-label={`${o.symbol} result unit`} className="field-input w-auto py-0.5 text-xs" value={outUnits[o.symbol]} onChange={(e) => { setOutUnits({ ...outUnits, [o.symbol]: e.target.value }); run.reset(); }}>
                {unitChoices(o.unit).map((u) => <option key={u} value={u}>{u}</option>)}
              </select>
            </label>
          ))}
        </fieldset>
      )}
      <Caution />
    </aside>
  );
}

