'use client';

import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';

interface Mail { id: number; to: string; subject: string; body: string; kind: string; status: string; error: string | null; createdAt: string; sentAt: string | null }

export function MailView() {
  const q = useQuery({ queryKey: ['mail'], queryFn: () => api<{ items: Mail[] }>('/api/admin/mail') });
  return (
    <section className="panel space-y-3">
      <h1 className="text-lg font-semibold">Sent mail</h1>
      <p className="text-sm text-ink-soft">Every notification Correlary has sent or still has to send, newest first (the last 200): review requests, decisions, withdrawals and the work they affect. Open a subject to read the message as it was sent. A message that could not be delivered is tried again after the next change.</p>
      <QueryState query={q}>
        {(d) => (
          <table className="table-plain">
            <thead><tr><th>Queued (UTC)</th><th>To</th><th>Subject</th><th>Kind</th><th>Status</th></tr></thead>
            <tbody>{d.items.map((m) => (
              <tr key={m.id}>
                <td className="whitespace-nowrap text-xs">{m.createdAt.slice(0, 19).replace('T', ' ')}</td><td className="text-xs">{m.to}</td>
                <td><details><summary className="cursor-pointer text-sm">{m.subject}</summary><pre className="mt-1 whitespace-pre-wrap text-xs text-ink-soft">{m.body}</pre></details></td>
                <td className="text-xs">{m.kind}</td>
                <td className={`text-xs ${m.status === 'sent' ? 'text-ok' : m.status === 'failed' ? 'text-danger' : 'text-caution'}`}>
                  {m.status === 'sent' ? `sent ${m.sentAt?.slice(11, 16) ?? ''}` : m.status === 'failed' ? 'not delivered' : m.status === 'sending' ? 'being sent' : 'waiting'}
                  {m.error && <div className="max-w-xs text-ink-soft">{m.error.slice(0, 200)}</div>}
                </td>
              </tr>
            ))}</tbody>
          </table>
        )}
      </QueryState>
    </section>
  );
}
