'use client';

import Link from 'next/link';
import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { StatusBadge } from '@/components/ui/status-badge';
import type { ApiAnswer } from '@/lib/client/typed';

type Templates = ApiAnswer<'/api/templates', 'get'>;

/** Governed calculation templates: chains of approved correlations, signed off like a correlation. */
export function TemplateList() {
  const q = useQuery({ queryKey: ['templates'], queryFn: () => api<Templates>('/api/templates?pageSize=200') });
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-xl font-semibold">Calculation templates</h1>
        <p className="text-sm text-ink-soft">Each template chains approved correlation versions — film temperature, properties, dimensionless groups, the correlation picked by its stated rule, h and q — and is validated and signed off like a correlation. Start a calculation from one.</p>
      </div>
      <QueryState query={q}>
        {(d) => (
          <ul className="grid gap-3 md:grid-cols-2">
            {d.items.map((t) => (
              <li key={t.slug} className="panel space-y-1">
                <div className="flex items-center gap-2"><Link className="font-medium text-brand-dark underline" href={`/templates/${t.slug}`}>{t.title}</Link>{t.status && <StatusBadge status={t.status} />}</div>
                <p className="text-xs text-ink-soft">{t.category} · {t.situation} · <code>{t.slug}</code>{t.version ? ` v${t.version}` : ''}</p>
              </li>
            ))}
          </ul>
        )}
      </QueryState>
    </div>
  );
}
