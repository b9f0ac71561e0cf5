'use client';

import Link from 'next/link';
import type { ChainStep, LeafStep, TemplateDefinition } from '@/lib/engine/template-types';
import { Sym, UnitText } from '@/components/ui/sym';

function Leaf({ step }: { step: LeafStep }) {
  switch (step.kind) {
    case 'correlation':
      return (
        <div>
          <p className="font-medium">{step.title}</p>
          <p className="text-xs"><Link className="font-mono text-brand-dark underline" href={`/correlations/${step.use.slug}/versions/${step.use.version}`}>{step.use.slug} v{step.use.version}</Link> <span className="text-ink-soft">· {step.use.contentHash.slice(0, 10)}</span></p>
          <p className="text-xs text-ink-soft">takes {Object.entries(step.inputs).map(([k, v]) => `${k} ← ${v}`).join(', ')}; gives {Object.entries(step.outputs).map(([k, v]) => (k === v ? k : `${v} (its ${k})`)).join(', ')}</p>
        </div>
      );
    case 'expression':
      return (
        <div>
          <p className="font-medium">{step.title}</p>
          {step.outputs.map((o) => <p key={o.symbol} className="font-mono text-xs">{o.symbol} = {o.expression} <UnitText unit={o.unit} /></p>)}
        </div>
      );
    default: { const never: never = step; return never; }
  }
}

function Step({ step }: { step: ChainStep }) {
  if (step.kind !== 'choice') return <Leaf step={step} />;
  return (
    <div className="space-y-1">
      <p className="font-medium">{step.title} <span className="text-xs font-normal text-ink-soft">(choice, gives {step.gives.join(', ')})</span></p>
      <p className="text-xs">{step.rule}</p>
      <ul className="space-y-1 border-l-2 border-line pl-3">
        {step.options.map((o) => <li key={o.label}><p className="text-xs"><strong>{o.label}</strong> {o.when ? <>when <code>{o.when}</code></> : 'otherwise'}</p>{o.steps.map((s) => <Leaf key={s.key} step={s} />)}</li>)}
      </ul>
    </div>
  );
}

/** The template's chain as a reviewer reads it: inputs, each step with its pinned version, the rules, results. */
export function ChainOutline({ definition }: { definition: TemplateDefinition }) {
  return (
    <div className="grid gap-4 lg:grid-cols-[1fr_20rem]">
      <ol className="space-y-2">
        {definition.steps.map((s, i) => <li key={s.key} className="panel flex gap-3 text-sm"><span className="font-mono text-xs text-ink-soft">{i + 1}</span><Step step={s} /></li>)}
      </ol>
      <aside className="space-y-3 text-sm">
        <section className="panel"><h3 className="font-semibold">Inputs</h3><ul>{definition.inputs.map((i) => <li key={i.symbol}><Sym s={i.symbol} /> {i.name} <UnitText unit={i.unit} /></li>)}</ul></section>
        {(definition.constants ?? []).length > 0 && <section className="panel"><h3 className="font-semibold">Constants</h3><ul>{definition.constants!.map((c) => <li key={c.symbol}><Sym s={c.symbol} /> = {c.value} <UnitText unit={c.unit} /> <span className="text-ink-soft">{c.name}</span></li>)}</ul></section>}
        <section className="panel"><h3 className="font-semibold">Results</h3><ul>{definition.outputs.map((o) => <li key={o.symbol}><Sym s={o.symbol} /> {o.name}</li>)}</ul></section>
        <section className="panel"><h3 className="font-semibold">References</h3><ul className="space-y-1 text-xs">{definition.references.map((r) => <li key={r.citation}>{r.citation}{r.locator ? `, ${r.locator}` : ''}</li>)}</ul></section>
        {definition.notes && <section className="panel text-xs"><h3 className="text-sm font-semibold">Notes</h3>{definition.notes}</section>}
      </aside>
    </div>
  );
}
