'use client';

import Link from 'next/link';
import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { StatusBadge } from '@/components/ui/status-badge';
import { Caution } from '@/components/ui/caution';
import { CopyButton } from '@/components/ui/copy-button';
import { EvaluatePanel } from './evaluate-panel';
import { DefinitionFacts, EquationsSection } from './definition-summary';
import { SweepChart } from './sweep-chart';
import { ScriptSnippets } from './script-snippets';
import { VersionActions } from './version-actions';
import { ValidationReportView } from './validation-report';
import { ChainOutline } from '@/components/calculation/chain-outline';
import type { TemplateDefinition } from '@/lib/engine/template-types';
import type { CorrelationSummary, VersionDetail, Viewer } from './types';

export function VersionView({ slug, version, user }: { slug: string; version: number; user: Viewer }) {
  const detail = useQuery({ queryKey: ['version', slug, version], queryFn: () => api<VersionDetail>(`/api/correlations/${slug}/versions/${version}`) });
  const summary = useQuery({ queryKey: ['correlation', slug], queryFn: () => api<CorrelationSummary>(`/api/correlations/${slug}`) });

  return (
    <QueryState query={detail}>
      {(v) => {
        const d = v.definition;
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
              {['draft', 'in_review'].includes(v.status) && <p className="rounded border border-caution-line bg-caution-bg px-3 py-2 text-sm text-caution">This version is <strong>{v.status.replace('_', ' ')}</strong>: not approved for design use.</p>}
              {v.status === 'returned' && (() => {
                const back = [...v.signOffs].reverse().find((s) => s.decision === 'returned');
                return (
                  <div role="note" className="space-y-1 rounded border border-caution-line bg-caution-bg px-3 py-2 text-sm">
                    <p className="text-caution"><strong>Returned to its author</strong>{back ? ` by ${back.by}, ${back.at.slice(0, 10)}` : ''}: not approved for design use.</p>
                    {back?.comment && <p className="text-ink">“{back.comment}”</p>}
                    {v.authorId === user.id && <p className="text-ink-soft">This version stays as it was, for the record. To address the comment, start a new version from it below, change what was asked and submit it again.</p>}
                  </div>
                );
              })()}
              <VersionActions detail={v} user={user} />
            </header>

            {v.kind === 'template' ? (
              <>
                <p className="text-sm">A calculation template: <Link className="text-brand-dark underline" href={`/templates/${slug}?version=${v.version}`}>run it or start a calculation from it</Link>.</p>
                <ChainOutline definition={v.definition as unknown as TemplateDefinition} />
              </>
            ) : (<>
            <EquationsSection v={v} />

            <div className="grid gap-5 lg:grid-cols-[1fr_380px]">
              <div className="space-y-5">
                <DefinitionFacts v={v} />
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
