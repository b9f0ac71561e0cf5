'use client';

import { Tex } from '@/components/ui/tex';
import { formatNumber } from '@/lib/client/units';
import { symbolTex } from '@/lib/engine/tex-symbols';
import type { VersionDetail } from './types';

function fmtLimit(min?: number, max?: number, minInc = true, maxInc = true) {
  const lo = min !== undefined ? `${formatNumber(min, 6)} ${minInc ? '≤' : '<'} ` : '';
  const hi = max !== undefined ? ` ${maxInc ? '≤' : '<'} ${formatNumber(max, 6)}` : '';
  return { lo, hi };
}

/** The typeset equations of a version, with its tables shown as tables. */
export function EquationsSection({ v }: { v: VersionDetail }) {
  const d = v.definition;
  // Outputs that merely pass on a tabulated value are shown with their table, not as equations.
  const tableAliases = new Set((d.steps ?? []).filter((s) => s.kind === 'table').map((s) => s.symbol));
  return (
    <section className="panel space-y-2" aria-label="Equations">
      <h2 className="font-semibold">Equations</h2>
      {(d.steps ?? []).filter((s) => s.kind !== 'table').map((s) => v.tex[s.symbol] && <div key={s.symbol} className="text-ink-soft"><Tex tex={v.tex[s.symbol]} display /></div>)}
      {d.outputs.filter((o) => !tableAliases.has(o.expression.trim())).map((o) => v.tex[o.symbol] && <div key={o.symbol}><Tex tex={v.tex[o.symbol]} display /></div>)}
      {(d.tables ?? []).map((t) => {
        const steps = (d.steps ?? []).filter((s) => s.kind === 'table' && s.table === t.name);
        const key = t.columns.find((c) => c.name === t.key);
        return (
          <div key={t.name} className="space-y-2 text-sm">
            <p>
              {steps.map((s) => d.outputs.find((o) => o.expression.trim() === s.symbol)?.symbol ?? s.symbol).join(', ')} interpolated linearly in{' '}
              <code>{steps[0]?.kind === 'table' ? steps[0].at : t.key}</code> from table <strong>{t.name}</strong> ({key?.values.length ?? 0} rows, {key?.values[0]}–{key?.values[key.values.length - 1]} {key?.unit}); outside it the value is extrapolated and flagged.
            </p>
            <p className="text-xs text-ink-soft">Source: {t.source}</p>
            <details>
              <summary className="cursor-pointer text-sm font-medium">Show the tabulated values</summary>
              <div className="mt-2 max-h-96 overflow-auto" tabIndex={0} role="region" aria-label="Tabulated values">
                <table className="table-plain">
                  <thead><tr>{t.columns.map((c) => <th key={c.name} className="normal-case">{c.name} <span className="font-normal text-ink-faint">[{c.unit}]</span></th>)}</tr></thead>
                  <tbody>{key?.values.map((_, r) => <tr key={r}>{t.columns.map((c) => <td key={c.name} className="font-mono text-xs">{formatNumber(c.values[r], 6)}</td>)}</tr>)}</tbody>
                </table>
              </div>
            </details>
          </div>
        );
      })}
    </section>
  );
}

/** Inputs and outputs with units, validity ranges, property basis, notes and references: what a reviewer signs. */
export function DefinitionFacts({ v }: { v: VersionDetail }) {
  const d = v.definition;
  return (
    <>
      <section className="panel" aria-label="Inputs and outputs">
        <h2 className="mb-2 font-semibold">Inputs and outputs</h2>
        <table className="table-plain">
          <thead><tr><th>Symbol</th><th>Quantity</th><th>Unit</th></tr></thead>
          <tbody>
            {d.inputs.map((i) => <tr key={i.symbol}><td><Tex tex={symbolTex(i.symbol)} /> <code className="text-xs text-ink-faint">{i.symbol}</code></td><td>{i.name}{i.description && <div className="text-xs text-ink-faint">{i.description}</div>}</td><td className="font-mono text-xs">{i.unit}</td></tr>)}
            {d.outputs.map((o) => <tr key={o.symbol} className="bg-brand-light/30"><td><Tex tex={symbolTex(o.symbol)} /> <code className="text-xs text-ink-faint">{o.symbol}</code></td><td>{o.name} <span className="text-xs text-ink-faint">(result)</span></td><td className="font-mono text-xs">{o.unit}</td></tr>)}
          </tbody>
        </table>
      </section>
      <section className="panel" aria-label="Validity ranges">
        <h2 className="mb-2 font-semibold">Validity ranges</h2>
        {(d.validity ?? []).length === 0 ? <p className="text-sm text-ink-faint">No limits declared.</p> : (
          <ul className="space-y-1 text-sm">
            {d.validity!.map((l, k) => {
              const { lo, hi } = fmtLimit(l.min, l.max, l.minInclusive, l.maxInclusive);
              return <li key={k}><code className="font-mono">{lo}{l.symbol}{hi}</code> <span className={`ml-1 rounded px-1.5 text-xs ${l.action === 'refuse' ? 'bg-danger-bg text-danger' : 'bg-caution-bg text-caution'}`}>{l.action === 'refuse' ? 'hard limit: refused outside' : 'warns outside'}</span>{l.note && <span className="text-ink-soft"> — {l.note}</span>}</li>;
            })}
          </ul>
        )}
        {d.propertyBasis && <p className="mt-3 text-sm"><strong>Property basis:</strong> {d.propertyBasis}</p>}
        {d.notes && <p className="mt-2 text-sm text-ink-soft"><strong className="text-ink">Notes:</strong> {d.notes}</p>}
      </section>
      <section className="panel" aria-label="References">
        <h2 className="mb-2 font-semibold">References</h2>
        <ol className="list-decimal space-y-1 pl-5 text-sm">
          {d.references.map((r, k) => <li key={k}>{r.citation}{r.locator && <span className="text-ink-soft">, {r.locator}</span>}{r.doi && <span className="text-ink-soft">. doi:{r.doi}</span>}</li>)}
        </ol>
      </section>
    </>
  );
}
