'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { Field } from '@/components/ui/field';
import { QueryState } from '@/components/ui/query-state';
import { CopyButton } from '@/components/ui/copy-button';

interface TokenRow {
  id: number; name: string; prefix: string; scopes: string[]; userEmail: string;
  expiresAt: string | null; revokedAt: string | null; lastUsedAt: string | null; createdAt: string;
}

const fmt = (d: string | null) => (d ? new Date(d).toISOString().slice(0, 16).replace('T', ' ') : '—');

/** Lists and creates API tokens: the caller's own, or every user's for an admin (`all`). */
export function TokenManager({ all = false }: { all?: boolean }) {
  const qc = useQueryClient();
  const key = ['tokens', all];
  const tokens = useQuery({ queryKey: key, queryFn: () => api<{ items: TokenRow[] }>(`/api/tokens${all ? '?all=1' : ''}`) });
  const [form, setForm] = useState({ name: '', read: true, evaluate: true, write: false, expiresInDays: '90' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [created, setCreated] = useState<string | null>(null);
  const create = useMutation({
    mutationFn: () => api<{ token: string }>('/api/tokens', {
      body: {
        name: form.name,
        scopes: [form.read && 'read', form.evaluate && 'evaluate', form.write && 'write'].filter(Boolean),
        expiresInDays: form.expiresInDays.trim() === '' ? null : Number(form.expiresInDays),
      },
    }),
    onSuccess: (t) => { setCreated(t.token); setErrors({}); setForm({ ...form, name: '' }); qc.invalidateQueries({ queryKey: ['tokens'] }); },
    onError: (e) => setErrors(e instanceof ApiError ? { ...e.fieldErrors(), form: e.message } : { form: String(e) }),
  });
  const [confirming, setConfirming] = useState<number | null>(null);
  const [revoked, setRevoked] = useState<string | null>(null);
  const revoke = useMutation({
    mutationFn: (t: TokenRow) => api(`/api/tokens/${t.id}`, { method: 'DELETE' }).then(() => t),
    onSuccess: (t) => { setConfirming(null); setRevoked(`Token “${t.name}” (${t.prefix}…) is revoked: requests with it are refused within a second.`); qc.invalidateQueries({ queryKey: ['tokens'] }); },
  });

  return (
    <section className="panel space-y-4">
      <h2 className="text-lg font-semibold">{all ? 'All API tokens' : 'My API tokens'}</h2>
      <form className="grid gap-3 sm:grid-cols-[1fr_auto_auto]" noValidate aria-label="Create an API token"
        onSubmit={(e) => { e.preventDefault(); setCreated(null); create.mutate(); }}>
        <Field label="Token name" error={errors.name}>{(p) => <input {...p} className="field-input" placeholder="e.g. sizing script" value={form.name} onChange={(e) => setForm({ ...form, name: e.target.value })} />}</Field>
        <Field label="Expires in (days)" hint="Empty: never" error={errors.expiresInDays}>{(p) => <input {...p} inputMode="numeric" className="field-input w-28" value={form.expiresInDays} onChange={(e) => setForm({ ...form, expiresInDays: e.target.value })} />}</Field>
        <fieldset className="space-y-1">
          <legend className="text-sm font-medium">Scopes</legend>
          <label className="flex items-center gap-1 text-sm"><input type="checkbox" checked={form.read} onChange={(e) => setForm({ ...form, read: e.target.checked })} />read</label>
          <label className="flex items-center gap-1 text-sm"><input type="checkbox" checked={form.evaluate} onChange={(e) => setForm({ ...form, evaluate: e.target.checked })} />evaluate</label>
          <label className="flex items-center gap-1 text-sm" title="author drafts and save calculations"><input type="checkbox" checked={form.write} onChange={(e) => setForm({ ...form, write: e.target.checked })} />write</label>
          {errors.scopes && <p className="text-xs text-danger">{errors.scopes}</p>}
        </fieldset>
        <div className="sm:col-span-3 flex items-center gap-3">
          <button className="btn-primary" disabled={create.isPending}>Create token</button>
          {errors.form && !errors.name && <p role="alert" className="text-sm text-danger">{errors.form}</p>}
        </div>
      </form>
      {created && (
        <div role="status" className="rounded border border-caution-line bg-caution-bg p-3 text-sm">
          <p className="font-medium">Copy this token now; it will not be shown again.</p>
          <div className="mt-1 flex items-start gap-2">
            <code data-testid="new-token" className="block flex-1 break-all rounded bg-paper-raised px-2 py-1">{created}</code>
            <CopyButton text={created} describe="the new token" />
          </div>
        </div>
      )}
      {revoked && <p role="status" className="rounded bg-ok-bg px-3 py-2 text-sm text-ok">{revoked}</p>}
      {revoke.isError && <p role="alert" className="text-sm text-danger">{revoke.error.message}</p>}
      <QueryState query={tokens}>
        {(data) => data.items.length === 0 ? <p className="text-sm text-ink-faint">No tokens yet.</p> : (
          <table className="table-plain">
            <thead><tr><th>Name</th>{all && <th>User</th>}<th>Prefix</th><th>Scopes</th><th>Expires</th><th>Last used</th><th /></tr></thead>
            <tbody>
              {data.items.map((t) => (
                <tr key={t.id} className={t.revokedAt ? 'text-ink-faint line-through' : ''}>
                  <td>{t.name}</td>{all && <td>{t.userEmail}</td>}<td><code>{t.prefix}…</code></td><td>{t.scopes.join(', ')}</td>
                  <td>{fmt(t.expiresAt)}</td><td>{fmt(t.lastUsedAt)}</td>
                  <td className="whitespace-nowrap">{t.revokedAt ? 'revoked' : confirming === t.id ? (
                    <span className="inline-flex flex-wrap items-center gap-1">
                      <span className="text-xs">Scripts using it stop working.</span>
                      <button type="button" className="btn-danger px-2 py-1 text-xs" disabled={revoke.isPending} onClick={() => revoke.mutate(t)}>Revoke “{t.name}”</button>
                      <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => setConfirming(null)}>Keep it</button>
                    </span>
                  ) : <button type="button" className="btn-quiet" aria-label={`Revoke the token ${t.name}`} onClick={() => { setRevoked(null); setConfirming(t.id); }}>Revoke…</button>}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </QueryState>
    </section>
  );
}
