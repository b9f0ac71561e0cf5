'use client';

import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';

interface Audit {
  chain: { intact: boolean; events: number; firstBrokenId?: number; reason?: string };
  items: { id: number; at: string; actor: string; action: string; entity: string; afterHash: string | null; details: Record<string, unknown>; hash: string }[];
  total: number;
}

export function AuditView() {
  const [page, setPage] = useState(1);
  const q = useQuery({ queryKey: ['audit', page], queryFn: () => api<Audit>(`/api/admin/audit?page=${page}&pageSize=50`), placeholderData: keepPreviousData });
  return (
    <QueryState query={q}>
      {(d) => (
        <section className="panel space-y-3">
          <h1 className="text-lg font-semibold">Audit trail</h1>
          <p role="status" data-testid="chain-status" className={`rounded px-3 py-2 text-sm ${d.chain.intact ? 'bg-ok-bg text-ok' : 'bg-danger-bg text-danger'}`}>
            {d.chain.intact ? `Hash chain intact: ${d.chain.events} events verified.` : `Hash chain BROKEN at event ${d.chain.firstBrokenId ?? '?'}: ${d.chain.reason}.`}
          </p>
          <table className="table-plain">
            <thead><tr><th>#</th><th>When (UTC)</th><th>Who</th><th>What</th><th>Subject</th><th>Details</th><th>Hash</th></tr></thead>
            <tbody>{d.items.map((e) => (
              <tr key={e.id} className={d.chain.firstBrokenId === e.id ? 'bg-danger-bg' : ''}>
                <td className="font-mono text-xs">{e.id}</td><td className="whitespace-nowrap text-xs">{e.at.slice(0, 19).replace('T', ' ')}</td><td className="text-xs">{e.actor}</td>
                <td className="font-mono text-xs">{e.action}</td><td className="font-mono text-xs">{e.entity}</td>
                <td className="max-w-sm truncate text-xs text-ink-soft" title={JSON.stringify(e.details)}>{JSON.stringify(e.details)}</td>
                <td className="font-mono text-xs">{e.hash.slice(0, 10)}…</td>
              </tr>
            ))}</tbody>
          </table>
          <nav className="flex items-center gap-2 text-sm">
            <button type="button" className="btn-quiet" disabled={page <= 1} onClick={() => setPage(page - 1)}>Newer</button>
            <span>Page {page} of {Math.max(1, Math.ceil(d.total / 50))}</span>
            <button type="button" className="btn-quiet" disabled={page * 50 >= d.total} onClick={() => setPage(page + 1)}>Older</button>
          </nav>
        </section>
      )}
    </QueryState>
  );
}
