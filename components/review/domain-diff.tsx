'use client';

import type { CheckCase, Definition, ValidityLimit } from '@/lib/engine/types';
import type { VersionDetail } from '@/components/correlation/types';
import { Tex } from '@/components/ui/tex';
import { Sym } from '@/components/ui/sym';
import { formatNumber } from '@/lib/client/units';
import { DefinitionDiff } from './definition-diff';

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

function rangeText(limits: ValidityLimit[] | undefined, symbol: string): string {
  const mine = (limits ?? []).filter((l) => l.symbol === symbol);
  if (!mine.length) return 'no range';
  return mine.map((l) => {
    const lo = l.min !== undefined ? `${formatNumber(l.min, 6)} ${l.minInclusive === false ? '<' : '≤'} ` : '';
    const hi = l.max !== undefined ? ` ${l.maxInclusive === false ? '<' : '≤'} ${formatNumber(l.max, 6)}` : '';
    return `${lo}${symbol}${hi}${l.action === 'refuse' ? ' (refused outside)' : ''}`;
  }).join('; ');
}

const caseInputs = (c: CheckCase) => Object.entries(c.inputs).map(([s, v]) => `${s} = ${typeof v === 'number' ? formatNumber(v, 6) : `${formatNumber(v.value, 6)} ${v.unit}`}`).join(', ');
const caseExpected = (c: CheckCase) => Object.entries(c.expected).map(([s, v]) => `${s} = ${formatNumber(v, 7)}`).join(', ');

/**
 * What changed between the previously approved version and this one, in the trade's terms: formulas before and
 * after (typeset), inputs and outputs, constants, validity ranges, accuracy, references and check cases. The raw
 * definition, line by line, is one click further for those who want it.
 */
export function DomainDiff({ before, after }: { before: VersionDetail; after: VersionDetail }) {
  const a: Definition = before.definition;
  const b: Definition = after.definition;

  const formulaOf = (d: Definition, symbol: string) => {
    const step = (d.steps ?? []).find((s) => s.symbol === symbol);
    if (step) return step.kind === 'expression' ? step.expression : step.kind === 'solve' ? `0 = ${step.residual} (between ${step.bracket.join(' and ')})` : `table ${step.table}, column ${step.column} at ${step.at}`;
    return d.outputs.find((o) => o.symbol === symbol)?.expression;
  };
  const computed = [...new Set([...(a.steps ?? []).map((s) => s.symbol), ...a.outputs.map((o) => o.symbol), ...(b.steps ?? []).map((s) => s.symbol), ...b.outputs.map((o) => o.symbol)])];
  const formulas = computed.map((symbol) => ({ symbol, was: formulaOf(a, symbol), now: formulaOf(b, symbol) })).filter((f) => f.was !== f.now);

  const declared = (d: Definition) => new Map([...d.inputs.map((i) => [i.symbol, `${i.name} [${i.unit}]`] as const), ...d.outputs.map((o) => [o.symbol, `${o.name} [${o.unit}] (result)`] as const)]);
  const da = declared(a);
  const db = declared(b);
  const symbolChanges = [...new Set([...da.keys(), ...db.keys()])].filter((s) => da.get(s) !== db.get(s)).map((s) => ({ s, was: da.get(s), now: db.get(s) }));

  const ca = new Map((a.constants ?? []).map((c) => [c.symbol, c]));
  const cb = new Map((b.constants ?? []).map((c) => [c.symbol, c]));
  const constantChanges = [...new Set([...ca.keys(), ...cb.keys()])].filter((s) => !same(ca.get(s), cb.get(s)));

  const limitSymbols = [...new Set([...(a.validity ?? []), ...(b.validity ?? [])].map((l) => l.symbol))];
  const limitChanges = limitSymbols.filter((s) => rangeText(a.validity, s) !== rangeText(b.validity, s));

  const refKey = (r: Definition['references'][number]) => `${r.citation}${r.locator ? `, ${r.locator}` : ''}${r.doi ? ` doi:${r.doi}` : ''}`;
  const refsA = new Set(a.references.map(refKey));
  const refsB = new Set(b.references.map(refKey));
  const refsRemoved = [...refsA].filter((r) => !refsB.has(r));
  const refsAdded = [...refsB].filter((r) => !refsA.has(r));

  const other = [
    ['stated accuracy', a.accuracy ? `±${formatNumber(a.accuracy.rel * 100, 4)} % (${a.accuracy.basis})` : 'none', b.accuracy ? `±${formatNumber(b.accuracy.rel * 100, 4)} % (${b.accuracy.basis})` : 'none'],
    ['property basis', a.propertyBasis ?? '—', b.propertyBasis ?? '—'],
    ['title', a.title, b.title],
    ['summary', a.summary, b.summary],
    ['situation', a.situation, b.situation],
    ['notes', a.notes ?? '—', b.notes ?? '—'],
  ].filter(([, x, y]) => x !== y);

  const casesA = new Map(before.checkCases.map((c) => [c.label, c]));
  const casesB = new Map(after.checkCases.map((c) => [c.label, c]));
  const caseAdded = after.checkCases.filter((c) => !casesA.has(c.label));
  const caseRemoved = before.checkCases.filter((c) => !casesB.has(c.label));
  const caseChanged = after.checkCases.filter((c) => casesA.has(c.label) && !same(casesA.get(c.label), c));

  const nothing = !formulas.length && !symbolChanges.length && !constantChanges.length && !limitChanges.length && !refsAdded.length && !refsRemoved.length && !other.length && !caseAdded.length && !caseRemoved.length && !caseChanged.length;

  return (
    <div className="space-y-4" data-testid="domain-diff">
      {nothing && <p className="text-sm">The definition and check cases are the same as in version {before.version}.</p>}
      {formulas.length > 0 && (
        <section aria-labelledby="diff-formulas" className="space-y-2">
          <h3 id="diff-formulas" className="text-sm font-semibold">Formulas that changed</h3>
          {formulas.map((f) => (
            <div key={f.symbol} className="grid gap-2 md:grid-cols-2">
              <div className="rounded border border-line bg-paper-sunk p-2">
                <p className="text-xs text-ink-soft">version {before.version}</p>
                {f.was === undefined ? <p className="text-sm italic">not there</p> : before.tex[f.symbol] ? <Tex tex={before.tex[f.symbol]} display /> : <code className="text-xs">{f.symbol} = {f.was}</code>}
              </div>
              <div className="rounded border border-brand/40 bg-brand-light/30 p-2">
                <p className="text-xs text-ink-soft">version {after.version}, under review</p>
                {f.now === undefined ? <p className="text-sm italic">removed</p> : after.tex[f.symbol] ? <Tex tex={after.tex[f.symbol]} display /> : <code className="text-xs">{f.symbol} = {f.now}</code>}
              </div>
            </div>
          ))}
        </section>
      )}
      {(symbolChanges.length > 0 || constantChanges.length > 0 || limitChanges.length > 0 || other.length > 0) && (
        <table className="table-plain" aria-label="Changed quantities, constants and ranges">
          <thead><tr><th scope="col">What</th><th scope="col">Version {before.version}</th><th scope="col">Version {after.version}</th></tr></thead>
          <tbody>
            {symbolChanges.map((c) => <tr key={`s-${c.s}`}><th scope="row" className="font-normal"><Sym s={c.s} /></th><td>{c.was ?? <em>not there</em>}</td><td>{c.now ?? <em>removed</em>}</td></tr>)}
            {constantChanges.map((s) => {
              const x = ca.get(s);
              const y = cb.get(s);
              return <tr key={`c-${s}`}><th scope="row" className="font-normal">constant <Sym s={s} /></th><td className="font-mono">{x ? `${formatNumber(x.value, 8)} ${x.unit === '1' ? '' : x.unit}` : <em>not there</em>}</td><td className="font-mono">{y ? `${formatNumber(y.value, 8)} ${y.unit === '1' ? '' : y.unit}` : <em>removed</em>}</td></tr>;
            })}
            {limitChanges.map((s) => <tr key={`l-${s}`}><th scope="row" className="font-normal">validity of <Sym s={s} /></th><td className="font-mono text-xs">{rangeText(a.validity, s)}</td><td className="font-mono text-xs">{rangeText(b.validity, s)}</td></tr>)}
            {other.map(([what, x, y]) => <tr key={what}><th scope="row" className="font-normal">{what}</th><td className="text-xs">{x}</td><td className="text-xs">{y}</td></tr>)}
          </tbody>
        </table>
      )}
      {(refsAdded.length > 0 || refsRemoved.length > 0) && (
        <section aria-labelledby="diff-refs">
          <h3 id="diff-refs" className="text-sm font-semibold">References</h3>
          <ul className="text-sm">
            {refsAdded.map((r) => <li key={`+${r}`}><span className="font-medium text-ok">added:</span> {r}</li>)}
            {refsRemoved.map((r) => <li key={`-${r}`}><span className="font-medium text-danger">removed:</span> {r}</li>)}
          </ul>
        </section>
      )}
      {(caseAdded.length > 0 || caseRemoved.length > 0 || caseChanged.length > 0) && (
        <section aria-labelledby="diff-cases">
          <h3 id="diff-cases" className="text-sm font-semibold">Check cases: {caseAdded.length} added, {caseRemoved.length} removed, {caseChanged.length} changed</h3>
          <table className="table-plain" aria-label="Changed check cases">
            <thead><tr><th scope="col">Case</th><th scope="col">Change</th><th scope="col">Inputs</th><th scope="col">Expected</th><th scope="col">Source</th></tr></thead>
            <tbody>
              {caseAdded.map((c) => <tr key={`+${c.label}`}><td>{c.label}</td><td className="text-ok">added</td><td className="font-mono text-xs">{caseInputs(c)}</td><td className="font-mono text-xs">{caseExpected(c)}</td><td className="text-xs">{c.source.kind}: {c.source.citation}</td></tr>)}
              {caseRemoved.map((c) => <tr key={`-${c.label}`}><td>{c.label}</td><td className="text-danger">removed</td><td className="font-mono text-xs">{caseInputs(c)}</td><td className="font-mono text-xs">{caseExpected(c)}</td><td className="text-xs">{c.source.kind}: {c.source.citation}</td></tr>)}
              {caseChanged.map((c) => {
                const o = casesA.get(c.label)!;
                return <tr key={`~${c.label}`}><td>{c.label}</td><td>changed</td><td className="font-mono text-xs">{same(o.inputs, c.inputs) ? caseInputs(c) : `${caseInputs(o)} → ${caseInputs(c)}`}</td><td className="font-mono text-xs">{same(o.expected, c.expected) ? caseExpected(c) : `${caseExpected(o)} → ${caseExpected(c)}`}</td><td className="text-xs">{same(o.source, c.source) && same(o.tolerance, c.tolerance) ? `${c.source.kind}` : `${o.source.kind} → ${c.source.kind}; tolerance ${JSON.stringify(o.tolerance)} → ${JSON.stringify(c.tolerance)}`}</td></tr>;
              })}
            </tbody>
          </table>
        </section>
      )}
      <details className="rounded border border-line p-2">
        <summary className="cursor-pointer text-sm">The raw definition, line by line</summary>
        <div className="mt-2"><DefinitionDiff before={a} after={b} leftLabel={`version ${before.version} (${before.status})`} rightLabel={`version ${after.version} (this review)`} /></div>
      </details>
    </div>
  );
}
