'use client';

import Link from 'next/link';
import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';

interface Item { slug: string; title: string; version: number; author: string; submittedAt: string; contentHash: string; ownVersion: boolean }

export function ReviewQueue() {
  const q = useQuery({ queryKey: ['review-queue'], queryFn: () => api<{ items: Item[] }>('/api/review-queue') });
  return (
    <section className="panel">
      <QueryState query={q}>
        {(d) => d.items.length === 0 ? <p className="text-sm text-ink-faint">Nothing is waiting for review.</p> : (
          <table className="table-plain">
            <thead><tr><th>Correlation</th><th>Version</th><th>Author</th><th>Submitted</th><th>Content hash</th><th /></tr></thead>
            <tbody>{d.items.map((i) => (
              <tr key={`${i.slug}-${i.version}`}>
                <td>{i.title}<div className="font-mono text-xs text-ink-faint">{i.slug}</div></td>
                <td className="font-mono">v{i.version}</td><td>{i.author}</td><td className="text-xs">{i.submittedAt?.slice(0, 16).replace('T', ' ')}</td>
                <td className="font-mono text-xs">{i.contentHash.slice(0, 12)}…</td>
                <td>{i.ownVersion ? <span className="text-xs text-ink-faint">your own version: another approver signs</span> : <Link className="btn-primary" href={`/review/${i.slug}/${i.version}`}>Review</Link>}</td>
              </tr>
            ))}</tbody>
          </table>
        )}
      </QueryState>
    </section>
  );
}
