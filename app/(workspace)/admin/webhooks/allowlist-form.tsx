'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import type { ApiAnswer } from '@/lib/client/typed';
import { QueryState } from '@/components/ui/query-state';

type Allowlist = ApiAnswer<'/api/admin/webhook-allowlist', 'get'>;

/** Where webhooks may go: URL prefixes, one per line. Empty: no deliveries at all (deny by default). */
export function WebhookAllowlistForm() {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ['webhook-allowlist'], queryFn: () => api<Allowlist>('/api/admin/webhook-allowlist') });
  const [text, setText] = useState('');
  useEffect(() => { if (q.data) setText(q.data.prefixes.join('\n')); }, [q.data]);
  const save = useMutation({
    mutationFn: () => api<Allowlist>('/api/admin/webhook-allowlist', { method: 'PUT', body: { prefixes: text.split('\n').map((l) => l.trim()).filter(Boolean) } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['webhook-allowlist'] }),
  });
  const errors = save.error instanceof ApiError ? save.error.fieldErrors() : {};
  const firstError = Object.entries(errors).find(([k]) => k.startsWith('prefixes'))?.[1];
  return (
    <QueryState query={q}>
      {() => (
        <form className="panel max-w-2xl space-y-3" noValidate aria-label="Webhook allow-list" onSubmit={(e) => { e.preventDefault(); save.mutate(); }}>
          <h1 className="text-lg font-semibold">Webhook allow-list</h1>
          <p className="text-sm text-ink-soft">Deliveries go only to URLs that start with one of these prefixes (scheme, host, port and path), checked when an endpoint is registered and again before every delivery. Keep internal addresses off it unless a receiver really lives there.</p>
          <label htmlFor="prefixes" className="block text-sm font-medium">Allowed URL prefixes, one per line</label>
          <textarea id="prefixes" rows={6} className="field-input font-mono text-xs" value={text} aria-invalid={Boolean(firstError)} aria-describedby={firstError ? 'prefixes-error' : undefined} onChange={(e) => setText(e.target.value)} />
          {firstError && <p id="prefixes-error" className="text-xs text-danger">{firstError}</p>}
          <button type="submit" className="btn-primary" disabled={save.isPending}>Save the allow-list</button>
          {save.isSuccess && <p role="status" className="text-sm text-ok">Allow-list saved ({save.data.prefixes.length} prefix{save.data.prefixes.length === 1 ? '' : 'es'}); the change is in the audit trail.</p>}
          {save.isError && !firstError && <p role="alert" className="text-sm text-danger">{save.error.message}</p>}
        </form>
      )}
    </QueryState>
  );
}
