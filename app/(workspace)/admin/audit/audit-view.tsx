'use client';

import Link from 'next/link';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';

interface AuditItem {
  id: number; at: string; actor: string; action: string; entity: string; entityType: string; entityId: string;
  beforeHash: string | null; afterHash: string | null; details: Record<string, unknown> | null; hash: string;
}
interface Audit {
  chain: { intact: boolean; events: number; firstBrokenId?: number; reason?: string };
  items: AuditItem[];
  total: number;
}

const PAGE = 50;
const ACTIONS = [
  ['', 'any action'], ['version.', 'versions (all)'], ['version.approved', 'approvals'], ['version.returned', 'returns'],
  ['version.withdrawn', 'withdrawals'], ['version.submitted', 'submissions'], ['correlation.', 'new correlations'],
  ['calculation.', 'calculations'], ['project.', 'projects'], ['user.', 'users (all)'], ['user.roles-changed', 'role changes'],
  ['token.', 'API tokens'], ['integrity.', 'integrity alarms'], ['policy.', 'evidence policy'], ['webhooks.', 'webhooks'],
] as const;

/** Where an event's subject can be seen, when it has a page. */
function subjectLink(e: AuditItem): string | null {
  if (e.entityType === 'version') {
    const m = /^([a-z0-9-]+)@(\d+)$/.exec(e.entityId);
    return m ? `/correlations/${m[1]}/versions/${m[2]}` : null;
  }
  if (e.entityType === 'correlation') return `/correlations/${e.entityId}`;
  if (e.entityType === 'calculation' && /^\d+$/.test(e.entityId)) return `/calculations/${e.entityId}`;
  if (e.entityType === 'project' && /^\d+$/.test(e.entityId)) return `/projects/${e.entityId}`;
  return null;
}

/** Details as short "key: value" lines instead of raw JSON; nested values are summarised. */
function DetailList({ details }: { details: Record<string, unknown> | null }) {
  const entries = Object.entries(details ?? {});
  if (!entries.length) return <span className="text-ink-soft">—</span>;
  const show = (v: unknown): string => {
    if (v === null || v === undefined) return '—';
    if (Array.isArray(v)) return v.map(show).join(', ');
    if (typeof v === 'object') return Object.entries(v as Record<string, unknown>).map(([k, x]) => `${k} ${show(x)}`).join('; ');
    return String(v);
  };
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-2 text-xs">
      {entries.slice(0, 6).map(([k, v]) => <div key={k} className="contents"><dt className="text-ink-soft">{k}</dt><dd className="break-words">{show(v).slice(0, 240)}</dd></div>)}
    </dl>
  );
}

export function AuditView() {
  const [page, setPage] = useState(1);
  const [draft, setDraft] = useState({ action: '', actor: '', subject: '', from: '', to: '' });
  const [filter, setFilter] = useState(draft);
  const params = new URLSearchParams(Object.entries(filter).filter(([, v]) => v.trim() !== ''));
  const q = useQuery({
    queryKey: ['audit', page, params.toString()],
    queryFn: () => api<Audit>(`/api/admin/audit?page=${page}&pageSize=${PAGE}${params.size ? `&${params}` : ''}`),
    placeholderData: keepPreviousData,
  });
  const apply = (e: React.FormEvent) => { e.preventDefault(); setPage(1); setFilter(draft); };

  return (
    <section className="panel space-y-3">
      <h1 className="text-lg font-semibold">Audit trail</h1>
      <form className="flex flex-wrap items-end gap-2" aria-label="Filter the audit trail" onSubmit={apply}>
        <label className="text-sm">What<select className="field-input" value={draft.action} onChange={(e) => setDraft({ ...draft, action: e.target.value })}>{ACTIONS.map(([v, l]) => <option key={v} value={v}>{l}</option>)}</select></label>
        <label className="text-sm">Who (e-mail or “system”)<input className="field-input w-56" value={draft.actor} onChange={(e) => setDraft({ ...draft, actor: e.target.value })} /></label>
        <label className="text-sm">Subject contains<input className="field-input w-48 font-mono" placeholder="slug, slug@2, id" value={draft.subject} onChange={(e) => setDraft({ ...draft, subject: e.target.value })} /></label>
        <label className="text-sm">From<input type="date" className="field-input" value={draft.from} onChange={(e) => setDraft({ ...draft, from: e.target.value })} /></label>
        <label className="text-sm">To<input type="date" className="field-input" value={draft.to} onChange={(e) => setDraft({ ...draft, to: e.target.value })} /></label>
        <button className="btn-primary">Show</button>
        <a className="btn-quiet" href={`/api/admin/audit?format=csv${params.size ? `&${params}` : ''}`} download>Export as CSV</a>
      </form>
      <QueryState query={q}>
        {(d) => (
          <>
            <p role="status" data-testid="chain-status" className={`rounded px-3 py-2 text-sm ${d.chain.intact ? 'bg-ok-bg text-ok' : 'bg-danger-bg text-danger'}`}>
              {d.chain.intact ? `Hash chain intact: all ${d.chain.events} events verified.` : `Hash chain BROKEN at event ${d.chain.firstBrokenId ?? '?'}: ${d.chain.reason}.`}
              {' '}{d.total} event{d.total === 1 ? '' : 's'} match{d.total === 1 ? 'es' : ''} the filter.
            </p>
            <table className="table-plain">
              <thead><tr><th>#</th><th>When (UTC)</th><th>Who</th><th>What</th><th>Subject</th><th>Details</th><th>Event hash</th></tr></thead>
              <tbody>{d.items.map((e) => {
                const href = subjectLink(e);
                return (
                  <tr key={e.id} className={d.chain.firstBrokenId === e.id ? 'bg-danger-bg' : ''}>
                    <td className="font-mono text-xs">{e.id}</td>
                    <td className="whitespace-nowrap text-xs">{e.at.slice(0, 19).replace('T', ' ')}</td>
                    <td className="text-xs">{e.actor}</td>
                    <td className="font-mono text-xs">{e.action}</td>
                    <td className="text-xs"><span className="text-ink-soft">{e.entityType}</span> {href ? <Link className="font-mono text-brand-dark underline" href={href}>{e.entityId}</Link> : <span className="font-mono">{e.entityId}</span>}</td>
                    <td className="max-w-md"><DetailList details={e.details} /></td>
                    <td className="font-mono text-xs" title={e.hash}>{e.hash.slice(0, 10)}…</td>
                  </tr>
                );
              })}</tbody>
            </table>
            {d.items.length === 0 && <p className="text-sm text-ink-soft">No event matches this filter.</p>}
            <nav className="flex items-center gap-2 text-sm" aria-label="Pages of the audit trail">
              <button type="button" className="btn-quiet" disabled={page <= 1} onClick={() => setPage(page - 1)}>Newer</button>
              <span>Page {page} of {Math.max(1, Math.ceil(d.total / PAGE))}</span>
              <button type="button" className="btn-quiet" disabled={page * PAGE >= d.total} onClick={() => setPage(page + 1)}>Older</button>
            </nav>
          </>
        )}
      </QueryState>
    </section>
  );
}
