'use client';

import Link from 'next/link';
import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { StatusBadge } from '@/components/ui/status-badge';
import { Caution } from '@/components/ui/caution';
import { Tex } from '@/components/ui/tex';
import { CopyButton } from '@/components/ui/copy-button';
import { formatNumber } from '@/lib/client/units';
import { symbolTex } from '@/lib/engine/tex-symbols';
import { EvaluatePanel } from './evaluate-panel';
import { SweepChart } from './sweep-chart';
import { ScriptSnippets } from './script-snippets';
import { VersionActions } from './version-actions';
import { ValidationReportView } from './validation-report';
import { ChainOutline } from '@/components/calculation/chain-outline';
import type { TemplateDefinition } from '@/lib/engine/template-types';
import type { CorrelationSummary, VersionDetail, Viewer } from './types';

function fmtLimit(min?: number, max?: number, minInc = true, maxInc = true) {
  const lo = min !== undefined ? `${formatNumber(min, 6)} ${minInc ? '≤' : '<'} ` : '';
  const hi = max !== undefined ? ` ${maxInc ? '≤' : '<'} ${formatNumber(max, 6)}` : '';
  return { lo, hi };
}

export function VersionView({ slug, version, user }: { slug: string; version: number; user: Viewer }) {
  const detail = useQuery({ queryKey: ['version', slug, version], queryFn: () => api<VersionDetail>(`/api/correlations/${slug}/versions/${version}`) });
  const summary = useQuery({ queryKey: ['correlation', slug], queryFn: () => api<CorrelationSummary>(`/api/correlations/${slug}`) });

  return (
    <QueryState query={detail}>
      {(v) => {
        const d = v.definition;
        // Outputs that merely pass on a tabulated value are shown with their table, not as equations.
        const tableAliases = new Set((d.steps ?? []).filter((s) => s.kind === 'table').map((s) => s.symbol));
        return (
          <div className="space-y-5">
            <header className="space-y-2">
              <div className="flex flex-wrap items-center gap-3">
                <h1 className="text-xl font-semibold">{d.title}</h1>
                <StatusBadge status={v.status} />
                <span className="font-mono text-sm text-ink-soft">v{v.version}</span>
              </div>
              <p className="text-sm text-ink-soft">{d.summary}</p>
              <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs text-ink-soft">
                <span>slug <code className="text-ink">{slug}</code></span>
                <span>{d.category} · {d.situation}</span>
                <span>author {v.author}</span>
                {v.contentHash && <span className="flex items-center gap-1">content hash <code title={v.contentHash}>{v.contentHash.slice(0, 16)}…</code><CopyButton text={v.contentHash} /></span>}
              </div>
              {v.status === 'withdrawn' && <p role="alert" className="rounded border border-danger/40 bg-danger-bg px-3 py-2 text-sm text-danger"><strong>Withdrawn</strong> {v.withdrawnAt?.slice(0, 10)}: {v.withdrawnReason} It stays readable for traceability but is never served as the latest version.</p>}
              {v.status === 'superseded' && <p className="rounded border border-line bg-paper-sunk px-3 py-2 text-sm">A newer version of this correlation is approved. {summary.data?.latestApprovedVersion && <Link className="text-brand-dark underline" href={`/correlations/${slug}/versions/${summary.data.latestApprovedVersion}`}>Open version {summary.data.latestApprovedVersion}</Link>}</p>}
              {['draft', 'in_review', 'returned'].includes(v.status) && <p className="rounded border border-caution-line bg-caution-bg px-3 py-2 text-sm text-caution">This version is <strong>{v.status.replace('_', ' ')}</strong>: not approved for design use.</p>}
              <VersionActions detail={v} user={user} />
            </header>

            {v.kind === 'template' ? (
              <>
                <p className="text-sm">A calculation template: <Link className="text-brand-dark underline" href={`/templates/${slug}?version=${v.version}`}>run it or start a calculation from it</Link>.</p>
                <ChainOutline definition={v.definition as unknown as TemplateDefinition} />
              </>
            ) : (<>
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
                      <div className="mt-2 max-h-96 overflow-auto">
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

            <div className="grid gap-5 lg:grid-cols-[1fr_380px]">
              <div className="space-y-5">
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
              </div>
              <EvaluatePanel detail={v} />
            </div>

            <SweepChart detail={v} />
            <ScriptSnippets slug={slug} detail={v} />
            </>)}
            <ValidationReportView report={v.validation} checkCases={v.checkCases} />

            <section className="panel" aria-label="Versions and sign-offs">
              <h2 className="mb-2 font-semibold">Versions and sign-offs</h2>
              <QueryState query={summary}>
                {(s) => (
                  <table className="table-plain">
                    <thead><tr><th>Version</th><th>Status</th><th>Author</th><th>Content hash</th><th>Approved</th></tr></thead>
                    <tbody>
                      {s.versions.map((x) => (
                        <tr key={x.version} className={x.version === v.version ? 'bg-brand-light/40' : ''}>
                          <td><Link className="font-mono text-brand-dark hover:underline" href={`/correlations/${slug}/versions/${x.version}`}>v{x.version}</Link></td>
                          <td><StatusBadge status={x.status} /></td><td>{x.author}</td>
                          <td className="font-mono text-xs">{x.contentHash ? `${x.contentHash.slice(0, 12)}…` : '—'}</td>
                          <td className="text-xs">{x.approvedAt?.slice(0, 10) ?? ''}</td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                )}
              </QueryState>
              {v.signOffs.length > 0 && (
                <ul className="mt-3 space-y-2 text-sm">
                  {v.signOffs.map((s, k) => <li key={k} className="rounded border border-line p-2"><strong>{s.decision}</strong> by {s.by}, {s.at.slice(0, 16).replace('T', ' ')} UTC — <em>{s.meaning}</em>{s.comment && <div className="text-ink-soft">“{s.comment}”</div>}</li>)}
                </ul>
              )}
              {v.comments.length > 0 && (
                <div className="mt-3">
                  <h3 className="text-sm font-semibold">Comments</h3>
                  <ul className="space-y-1 text-sm">{v.comments.map((c, k) => <li key={k}><span className="text-ink-soft">{c.by}, {c.at.slice(0, 10)}:</span> {c.body}</li>)}</ul>
                </div>
              )}
            </section>
            <Caution />
          </div>
        );
      }}
    </QueryState>
  );
}
