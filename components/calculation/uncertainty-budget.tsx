'use client';

import { useState } from 'react';
import { formatNumber } from '@/lib/client/units';
import { bandText, percent as pct } from '@/lib/client/bands';
import { Sym, UnitText } from '@/components/ui/sym';
import type { RunAnswer } from './types';

type Uncertainty = NonNullable<RunAnswer['uncertainty']>;

/**
 * How sure each result is: its band from the stated accuracies of the steps, which step contributes how
 * much, and the sensitivities to the inputs. First-order propagation (lib/engine/uncertainty.ts).
 */
export function UncertaintyBudget({ uncertainty, names }: { uncertainty: Uncertainty | undefined; names: Record<string, string> }) {
  const symbols = Object.keys(uncertainty?.outputs ?? {});
  const preferred = ['q', 'h', 'q_s'].find((s) => symbols.includes(s)) ?? symbols[symbols.length - 1];
  const [picked, setPicked] = useState<string | undefined>(preferred);
  if (!uncertainty || !symbols.length) return <p className="text-sm text-ink-soft">No uncertainty budget for this record (saved before bands were propagated).</p>;
  const sym = picked && symbols.includes(picked) ? picked : preferred;
  const o = uncertainty.outputs[sym];
  return (
    <section className="panel space-y-3" aria-label="Uncertainty budget" data-testid="uncertainty-budget">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="font-semibold">How sure is this number?</h2>
        <label className="text-sm">result{' '}
          <select className="field-input w-auto" value={sym} onChange={(e) => setPicked(e.target.value)} aria-label="Result to explain">
            {symbols.map((s) => <option key={s} value={s}>{s}{names[s] ? ` — ${names[s]}` : ''}</option>)}
          </select>
        </label>
      </div>
      <p className="text-lg">
        <Sym s={sym} /> = <span className="font-mono" data-testid="budget-value">{formatNumber(o.value, 5)}</span> <UnitText unit={o.unit} />
        {o.rel !== null && <> <span className="font-mono" data-testid="budget-band">± {pct(o.rel)}</span></>}
        {!o.complete && <span className="ml-2 rounded bg-caution-bg px-2 py-0.5 text-xs font-medium text-caution">a step that moves it states no accuracy: the band leaves it out</span>}
      </p>
      <table className="table-plain" aria-label="Budget by step">
        <thead><tr><th scope="col">step</th><th scope="col">its output</th><th scope="col">stated band</th><th scope="col">sensitivity ∂ln{sym}/∂ε</th><th scope="col">part of the band</th><th scope="col" className="w-40">share</th></tr></thead>
        <tbody>
          {o.budget.map((l) => (
            <tr key={`${l.step}-${l.symbol}`} data-testid={`budget-${l.step}-${l.symbol}`}>
              <td>{l.title}{l.correlation && <span className="block font-mono text-xs text-ink-faint">{l.correlation.slug} v{l.correlation.version}</span>}</td>
              <td><Sym s={l.symbol} /></td>
              <td className="font-mono text-xs" title={l.basis ?? undefined}>{bandText(l)}</td>
              <td className="font-mono text-xs">{formatNumber(l.sensitivity, 3)}</td>
              <td className="font-mono text-xs">{l.contribution === null ? '—' : `± ${pct(l.contribution)}`}</td>
              <td>{l.share !== null && (
                <div className="flex items-center gap-2"><div className="h-2 rounded bg-brand" style={{ width: `${Math.max(1, l.share * 100)}%` }} aria-hidden /><span className="text-xs">{Math.round(l.share * 100)} %</span></div>
              )}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <table className="table-plain" aria-label="Sensitivities to the inputs">
        <caption className="text-left text-xs text-ink-soft">what matters: the change of {sym} per change of each input, and per relative change (elasticity)</caption>
        <thead><tr><th scope="col">input</th><th scope="col">∂{sym}/∂input</th><th scope="col">unit</th><th scope="col">elasticity ∂ln{sym}/∂ln input</th></tr></thead>
        <tbody>
          {Object.entries(o.sensitivities).map(([k, s]) => (
            <tr key={k} data-testid={`sensitivity-${k}`}><td><Sym s={k} /></td><td className="font-mono text-xs">{formatNumber(s.derivative, 4)}</td><td className="text-xs text-ink-soft">{s.unit}</td><td className="font-mono text-xs">{formatNumber(s.elasticity, 3)}</td></tr>
          ))}
        </tbody>
      </table>
      <p className="text-xs text-ink-faint">
        A band is the published accuracy of each correlation on the data it was fitted to, combined step by step ({uncertainty.method}). It is not a
        guarantee: a case unlike those data, a broken validity range or a wrong property basis can be further off. Check designs under the
        applicable codes with a responsible licensed engineer.
      </p>
    </section>
  );
}
