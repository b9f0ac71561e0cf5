'use client';

import Link from 'next/link';
import { useMutation, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { formatNumber } from '@/lib/client/units';
import { QueryState } from '@/components/ui/query-state';
import { Caution } from '@/components/ui/caution';
import { CopyButton } from '@/components/ui/copy-button';
import type { TemplateDefinition } from '@/lib/engine/template-types';
import { chainNotices, ResultsTable, StepChain } from './step-chain';
import { UncertaintyBudget } from './uncertainty-budget';
import { Sym } from '@/components/ui/sym';
import type { RunAnswer } from './types';

export interface CalculationDetail {
  id: number; title: string; project: { id: number; name: string }; owner: string; revision: number; latestRevision: number; contentHash: string; note: string;
  savedBy: string; savedAt: string; canEdit: boolean;
  content: { engineVersion: string; title: string; template: { slug: string; version: number; contentHash: string | null; title: string } | null; chain: TemplateDefinition; request: { inputs?: Record<string, unknown>; rows?: Record<string, unknown>[] }; answer: RunAnswer; ranBy: string; ranAt: string };
  flags: { slug: string; version: number; reason: string | null; withdrawnAt: string }[];
  revisions: { revision: number; contentHash: string; note: string; by: string; at: string }[];
}

interface Rerun {
  revision: number; moved: { slug: string; from: number; to: number | null }[]; error: string | null;
  steps: { key: string; title: string; before: { version: number } | null; after: { slug: string; version: number } | null; pickedBefore: string | null; pickedAfter: string | null; outputs: { symbol: string; before: number | null; after: number; change: number | null }[] }[];
  outputs: { symbol: string; before: number | null; after: number; change: number | null }[];
}

const pct = (c: number | null) => (c === null ? '—' : c === 0 ? 'same' : `${c > 0 ? '+' : ''}${(c * 100).toPrecision(3)} %`);

export function inputText(v: unknown, unit: string): string {
  if (v && typeof v === 'object' && 'value' in v) { const q = v as { value: number; unit?: string }; return `${q.value} ${q.unit ?? ''}`; }
  return `${v} ${unit === '1' ? '' : unit}`;
}

export function FlagBanner({ flags }: { flags: CalculationDetail['flags'] }) {
  if (!flags.length) return null;
  return (
    <div role="alert" className="rounded border border-danger/40 bg-danger-bg px-3 py-2 text-sm text-danger" data-testid="withdrawn-flag">
      <strong>Flagged:</strong> this calculation used {flags.map((f) => <span key={`${f.slug}${f.version}`}><Link className="underline" href={`/correlations/${f.slug}/versions/${f.version}`}>{f.slug} v{f.version}</Link>, withdrawn {f.withdrawnAt.slice(0, 10)}: {f.reason}. </span>)}
      Its results must be reviewed before they are used; re-run it against the latest approved versions below.
    </div>
  );
}

/** A saved revision (default the latest), shared by the calculation page and its report. */
export function useCalculation(id: number, revision?: number) {
  return useQuery({ queryKey: ['calculation', id, revision], queryFn: () => api<CalculationDetail>(`/api/calculations/${id}${revision ? `?revision=${revision}` : ''}`) });
}

/** A saved calculation revision: inputs, the chain step by step, results, flags, history, re-run and exports. */
export function CalculationView({ id, revision, justSaved }: { id: number; revision?: number; justSaved: boolean }) {
  const q = useCalculation(id, revision);
  const rerun = useMutation({ mutationFn: (n: number) => api<Rerun>(`/api/calculations/${id}/rerun?revision=${n}`, { method: 'POST' }) });
  return (
    <QueryState query={q}>
      {(c) => {
        const { content } = c;
        const a = content.answer;
        const names = Object.fromEntries(content.chain.outputs.map((o) => [o.symbol, o.name]));
        const warnCount = a.warnings?.length ?? 0;
        const notices = chainNotices(a.warnings, a.steps);
        const rows = content.request.rows;
        return (
          <div className="space-y-4">
            <header className="space-y-1">
              <p className="text-xs text-ink-soft"><Link className="underline" href="/projects">Calculations</Link> / <Link className="underline" href={`/projects/${c.project.id}`}>{c.project.name}</Link></p>
              <h1 className="text-xl font-semibold">{c.title}</h1>
              <p className="text-xs text-ink-soft">
                revision {c.revision} of {c.latestRevision} · saved by {c.savedBy} {c.savedAt.slice(0, 16).replace('T', ' ')} · engine {content.engineVersion} ·
                {content.template ? <> template <Link className="underline" href={`/templates/${content.template.slug}?version=${content.template.version}`}>{content.template.title} v{content.template.version}</Link></> : ' own chain'} ·
                content hash <code title={c.contentHash}>{c.contentHash.slice(0, 16)}…</code> <CopyButton text={c.contentHash} />
              </p>
              {c.note && <p className="text-sm">Note: {c.note}</p>}
              {justSaved && <p role="status" className="rounded bg-ok-bg px-2 py-1 text-sm text-ok">Saved as revision {c.revision}. It can no longer change; a change is a new revision.</p>}
              <div className="flex flex-wrap gap-2 pt-1">
                <Link className="btn-quiet" href={`/calculations/${id}/report?revision=${c.revision}`}>Report (print or save as PDF)</Link>
                <a className="btn-quiet" href={`/api/calculations/${id}?revision=${c.revision}`} download={`calculation-${id}-r${c.revision}.json`}>Export JSON</a>
                <a className="btn-quiet" href={`/api/calculations/${id}/csv?revision=${c.revision}`}>Export CSV</a>
                {!rows && <button type="button" className="btn-quiet" onClick={() => rerun.mutate(c.revision)} disabled={rerun.isPending}>{rerun.isPending ? 'Re-running…' : 'Re-run against the latest approved versions'}</button>}
                {content.template && <Link className="btn-quiet" href={`/templates/${content.template.slug}`}>Start a new calculation from the template</Link>}
              </div>
            </header>
            <FlagBanner flags={c.flags} />
            {rerun.data && <RerunView r={rerun.data} />}
            {rerun.isError && <p role="alert" className="rounded bg-danger-bg px-2 py-1 text-sm text-danger">{rerun.error.message}</p>}
            {!rows && (
              <div className="grid gap-4 lg:grid-cols-[20rem_1fr]">
                <aside className="space-y-3">
                  <section className="panel">
                    <h2 className="font-semibold">Inputs</h2>
                    <table className="table-plain"><tbody>{content.chain.inputs.map((i) => <tr key={i.symbol}><th scope="row"><Sym s={i.symbol} /></th><td className="font-mono">{inputText(content.request.inputs?.[i.symbol], i.unit)}</td><td className="text-xs text-ink-soft">{i.name}</td></tr>)}</tbody></table>
                  </section>
                  <Caution />
                </aside>
                <div className="space-y-4">
                  <section className="space-y-2">
                    <div className="flex items-center gap-3"><h2 className="font-semibold">Results</h2>{warnCount > 0 && <span className="rounded bg-caution-bg px-2 py-0.5 text-sm font-medium text-caution">⚠ {warnCount} range warning{warnCount === 1 ? '' : 's'}</span>}</div>
                    <ResultsTable outputs={a.outputs ?? {}} units={a.units} names={names} warned={warnCount > 0} bands={a.uncertainty?.outputs} />
                  </section>
                  <UncertaintyBudget uncertainty={a.uncertainty} names={names} />
                  <section className="space-y-2"><h2 className="font-semibold">Steps</h2><StepChain steps={a.steps ?? []} notices={notices} /></section>
                </div>
              </div>
            )}
            {rows && a.results && (
              <section className="panel space-y-2">
                <h2 className="font-semibold">{rows.length} cases</h2>
                <div className="max-h-[32rem] overflow-auto" tabIndex={0} role="region" aria-label="Result rows">
                  <table className="table-plain" aria-label="Case results">
                    <thead><tr><th scope="col">#</th>{content.chain.inputs.map((i) => <th scope="col" key={i.symbol}>{i.symbol}</th>)}{content.chain.outputs.map((o) => <th scope="col" key={o.symbol}>{o.symbol} [{a.units[o.symbol]}]</th>)}<th scope="col">warnings</th></tr></thead>
                    <tbody>{a.results.slice(0, 500).map((r, k) => (
                      <tr key={k} className={r.warnings.length || r.error ? 'bg-caution-bg' : ''}><td>{k + 1}</td>
                        {content.chain.inputs.map((i) => <td key={i.symbol} className="font-mono">{inputText(rows[k][i.symbol], i.unit)}</td>)}
                        {content.chain.outputs.map((o) => <td key={o.symbol} className="font-mono">{formatNumber(r.outputs?.[o.symbol], 5)}</td>)}
                        <td className="text-xs text-caution">{r.error?.message ?? r.warnings.map((w) => `${w.step}: ${w.message}`).join('; ')}</td></tr>
                    ))}</tbody>
                  </table>
                </div>
                <Caution />
              </section>
            )}
            <section className="panel" aria-label="Revisions">
              <h2 className="font-semibold">Revisions</h2>
              <ul className="text-sm">{c.revisions.map((r) => <li key={r.revision}><Link className="underline" href={`/calculations/${id}?revision=${r.revision}`}>revision {r.revision}</Link> · {r.by} · {r.at.slice(0, 16).replace('T', ' ')} · <code className="text-xs">{r.contentHash.slice(0, 12)}</code> {r.note && `· ${r.note}`}</li>)}</ul>
            </section>
          </div>
        );
      }}
    </QueryState>
  );
}

function RerunView({ r }: { r: Rerun }) {
  const changed = r.moved.filter((m) => m.to !== null && m.to !== m.from);
  return (
    <section className="panel space-y-2" aria-label="Re-run against the latest approved versions" data-testid="rerun">
      <h2 className="font-semibold">Re-run against the latest approved versions (not saved)</h2>
      <p className="text-sm">{changed.length ? `Newer approved versions: ${changed.map((m) => `${m.slug} v${m.from} → v${m.to}`).join(', ')}.` : 'Every correlation used is still at its latest approved version.'}
        {r.moved.some((m) => m.to === null) && ` No approved version any more: ${r.moved.filter((m) => m.to === null).map((m) => m.slug).join(', ')} (kept as saved).`}</p>
      {r.error ? <p role="alert" className="text-sm text-danger">{r.error}</p> : (
        <table className="table-plain">
          <thead><tr><th scope="col">step</th><th scope="col">version</th><th scope="col">symbol</th><th scope="col">saved</th><th scope="col">now</th><th scope="col">change</th></tr></thead>
          <tbody>
            {r.steps.flatMap((s) => s.outputs.map((o, k) => (
              <tr key={`${s.key}-${o.symbol}`} className={o.change ? 'bg-caution-bg' : ''}>
                {k === 0 && <td rowSpan={s.outputs.length}>{s.title}{s.pickedBefore !== s.pickedAfter && <p className="text-xs text-caution">choice: {s.pickedBefore ?? '—'} → {s.pickedAfter}</p>}</td>}
                {k === 0 && <td rowSpan={s.outputs.length} className="text-xs">{s.after ? `v${s.before?.version ?? '?'} → v${s.after.version}` : 'arithmetic'}</td>}
                <td><Sym s={o.symbol} /></td><td className="font-mono">{formatNumber(o.before, 6)}</td><td className="font-mono">{formatNumber(o.after, 6)}</td><td>{pct(o.change)}</td>
              </tr>
            )))}
          </tbody>
        </table>
      )}
    </section>
  );
}
