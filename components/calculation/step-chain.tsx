'use client';

import Link from 'next/link';
import { formatNumber } from '@/lib/client/units';
import { bandText } from '@/lib/client/bands';
import { Sym, UnitText } from '@/components/ui/sym';
import type { ChainWarningView, StepRecordView } from './types';

function Warnings({ warnings }: { warnings: ChainWarningView[] }) {
  if (!warnings.length) return null;
  return (
    <ul className="space-y-1" aria-label="Range warnings at this step">
      {warnings.map((w, k) => <li key={k} role="alert" className="rounded border border-caution-line bg-caution-bg px-2 py-1 text-xs font-medium text-caution">⚠ {w.message}</li>)}
    </ul>
  );
}

/** Warnings of a run that belong to no step's own list: limits on the inputs, template or pinned-version status. */
export function chainNotices(warnings: ChainWarningView[] | undefined, steps: StepRecordView[] | undefined): ChainWarningView[] {
  const own = new Set((steps ?? []).flatMap((s) => s.warnings.map((w) => `${w.step}\u0000${w.symbol}\u0000${w.message}`)));
  return (warnings ?? []).filter((w) => !own.has(`${w.step}\u0000${w.symbol}\u0000${w.message}`));
}

/**
 * The chain as it ran: one numbered card per executed step with what it took (in the units it takes
 * them), what it gave, the pinned version and any range warning right where it arose. Choices show
 * their rule and the option picked.
 */
export function StepChain({ steps, notices = [] }: { steps: StepRecordView[]; notices?: ChainWarningView[] }) {
  const inputNotices = notices.filter((w) => w.step === 'inputs' || w.step === 'template');
  return (
    <ol className="space-y-3" aria-label="Calculation steps">
      {inputNotices.length > 0 && <li><Warnings warnings={inputNotices} /></li>}
      {steps.map((s, i) => {
        const stepNotices = notices.filter((w) => w.step === s.key);
        const flagged = s.warnings.length + stepNotices.length > 0;
        return (
          <li key={s.key} className={`panel break-inside-avoid space-y-2 ${flagged ? 'border-caution-line' : ''}`} data-testid={`step-${s.key}`}>
            <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
              <span className="rounded bg-brand-light px-1.5 font-mono text-xs text-brand-dark">{i + 1}</span>
              <h3 className="font-medium">{s.title}</h3>
              {s.correlation ? (
                <Link className="font-mono text-xs text-brand-dark underline" href={`/correlations/${s.correlation.slug}/versions/${s.correlation.version}`} title={`content hash ${s.correlation.contentHash}`}>
                  {s.correlation.slug} v{s.correlation.version} · {s.correlation.contentHash.slice(0, 10)}
                </Link>
              ) : <span className="text-xs text-ink-soft">arithmetic step</span>}
            </div>
            {s.choice && (
              <p className="rounded border border-line bg-paper-sunk px-2 py-1 text-xs">
                <strong>{s.choice.title}:</strong> {s.choice.rule} <span className="whitespace-nowrap">→ <strong data-testid={`picked-${s.choice.key}`}>{s.choice.picked}</strong> (of {s.choice.options.join(', ')})</span>
                {s.correlation && (
                  <Link className="ml-2 whitespace-nowrap text-brand-dark underline" data-testid={`alternatives-${s.key}`}
                    href={`/advisor?${new URLSearchParams({ like: s.correlation.slug, ...Object.fromEntries(Object.entries(s.inputs).map(([k, v]) => [k, String(Number(v.toPrecision(6)))])) })}`}>
                    what the other correlations say here
                  </Link>
                )}
              </p>
            )}
            <div className="grid gap-3 sm:grid-cols-2">
              <table className="table-plain">
                <caption className="text-left text-xs text-ink-soft">takes</caption>
                <tbody>
                  {Object.entries(s.inputs).map(([k, v]) => <tr key={k}><th scope="row" className="w-24"><Sym s={k} /></th><td className="font-mono">{formatNumber(v, 6)}</td><td><UnitText unit={s.units[k] ?? '1'} /></td></tr>)}
                </tbody>
              </table>
              <table className="table-plain">
                <caption className="text-left text-xs text-ink-soft">gives</caption>
                <tbody>
                  {Object.entries(s.outputs).map(([k, v]) => <tr key={k}><th scope="row" className="w-24"><Sym s={k} /></th><td className="font-mono" data-testid={`value-${k}`}>{formatNumber(v, 6)}</td><td><UnitText unit={s.units[k] ?? '1'} /></td></tr>)}
                </tbody>
              </table>
            </div>
            <Warnings warnings={[...stepNotices, ...s.warnings]} />
          </li>
        );
      })}
    </ol>
  );
}

/** The results of a run with their units; rows with a warning anywhere in the chain are marked. */
export function ResultsTable({ outputs, units, names, warned, bands }: { outputs: Record<string, number>; units: Record<string, string>; names: Record<string, string>; warned: boolean; bands?: Record<string, { rel: number | null; complete: boolean }> }) {
  return (
    <table className={`table-plain ${warned ? 'outline outline-2 outline-caution-line' : ''}`} aria-label="Results">
      <thead><tr><th scope="col">result</th><th scope="col">symbol</th><th scope="col">value</th><th scope="col">unit</th>{bands && <th scope="col" title="propagated from the stated accuracy of every step">band</th>}</tr></thead>
      <tbody>
        {Object.entries(outputs).map(([k, v]) => (
          <tr key={k}>
            <td className="text-ink-soft">{names[k] ?? ''}</td><td><Sym s={k} /></td><td className="font-mono text-base" data-testid={`result-${k}`}>{formatNumber(v, 6)}</td><td><UnitText unit={units[k] ?? '1'} /></td>
            {bands && <td className="font-mono text-xs" data-testid={`result-band-${k}`}>{bands[k]?.rel == null ? '—' : `${bandText(bands[k])}${bands[k].complete ? '' : ' (incomplete)'}`}</td>}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
