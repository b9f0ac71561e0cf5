'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import type { ApiAnswer } from '@/lib/client/typed';
import { QueryState } from '@/components/ui/query-state';
import { WEBHOOK_EVENTS } from '@/lib/webhooks/events';

type Endpoints = ApiAnswer<'/api/webhooks', 'get'>;
type Registered = ApiAnswer<'/api/webhooks', 'post'>;
type Deliveries = ApiAnswer<'/api/webhooks/{id}/deliveries', 'get'>;

const EVENT_TEXT: Record<(typeof WEBHOOK_EVENTS)[number], string> = {
  'version.approved': 'a version is approved',
  'version.superseded': 'a version is superseded by a newer one',
  'version.withdrawn': 'a version is withdrawn',
  'calculation.flagged': 'one of your calculations is flagged (it used a withdrawn version)',
};

/** Your webhook endpoints: register one (its secret shown once), see each delivery, send one again, send a test. */
export function WebhooksManager() {
  const qc = useQueryClient();
  const list = useQuery({ queryKey: ['webhooks'], queryFn: () => api<Endpoints>('/api/webhooks'), refetchInterval: 5000 });
  const [form, setForm] = useState({ url: '', slugs: '', events: ['version.approved', 'version.withdrawn'] as string[] });
  const [created, setCreated] = useState<Registered | null>(null);
  const [copied, setCopied] = useState(false);
  const [open, setOpen] = useState<number | null>(null);
  const register = useMutation({
    mutationFn: () => api<Registered>('/api/webhooks', { body: { url: form.url, events: form.events, slugs: form.slugs.split(/[\s,]+/).map((s) => s.trim()).filter(Boolean) } }),
    onSuccess: (r) => { setCreated(r); setCopied(false); setForm({ ...form, url: '', slugs: '' }); void qc.invalidateQueries({ queryKey: ['webhooks'] }); },
  });
  const remove = useMutation({
    mutationFn: (id: number) => api(`/api/webhooks/${id}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['webhooks'] }),
  });
  const errors = register.error instanceof ApiError ? register.error.fieldErrors() : {};
  return (
    <section className="panel space-y-3" aria-labelledby="webhooks-heading">
      <h1 id="webhooks-heading" className="text-lg font-semibold">Webhooks</h1>
      <p className="text-sm text-ink-soft">Correlary posts a signed JSON message to your URL when a version you follow changes. Each request carries <code>Correlary-Webhook-Timestamp</code> and <code>Correlary-Webhook-Signature: v1=&lt;HMAC-SHA-256 of “timestamp.body” with your secret&gt;</code>; check it, refuse timestamps more than 5 minutes old, and ignore an id you have seen. Answer 2xx within 5 s, or the delivery is retried with growing intervals.</p>
      <form className="space-y-2 rounded border border-line p-3" noValidate aria-label="Register a webhook endpoint" onSubmit={(e) => { e.preventDefault(); register.mutate(); }}>
        <div>
          <label htmlFor="hook-url" className="block text-sm font-medium">Receiving URL</label>
          <input id="hook-url" className="field-input" placeholder="https://your-system.example/correlary" value={form.url} aria-invalid={Boolean(errors.url)} aria-describedby={errors.url ? 'hook-url-error' : 'hook-url-hint'} onChange={(e) => setForm({ ...form, url: e.target.value })} />
          {errors.url ? <p id="hook-url-error" className="text-xs text-danger">{errors.url}</p> : <p id="hook-url-hint" className="text-xs text-ink-soft">It must lie under a prefix an admin has allowed.</p>}
        </div>
        <fieldset>
          <legend className="text-sm font-medium">Tell me when</legend>
          {WEBHOOK_EVENTS.map((ev) => (
            <label key={ev} className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={form.events.includes(ev)} onChange={(e) => setForm({ ...form, events: e.target.checked ? [...form.events, ev] : form.events.filter((x) => x !== ev) })} />
              <span>{EVENT_TEXT[ev]} <code className="text-xs text-ink-soft">{ev}</code></span>
            </label>
          ))}
          {errors.events && <p className="text-xs text-danger">{errors.events}</p>}
        </fieldset>
        <div>
          <label htmlFor="hook-slugs" className="block text-sm font-medium">Correlations to follow (slugs, optional)</label>
          <input id="hook-slugs" className="field-input" placeholder="pipe-turbulent-gnielinski, friction-factor-colebrook" value={form.slugs} aria-describedby="hook-slugs-hint" onChange={(e) => setForm({ ...form, slugs: e.target.value })} />
          <p id="hook-slugs-hint" className="text-xs text-ink-soft">Leave empty to follow every correlation your API tokens have evaluated.</p>
          {errors.slugs && <p className="text-xs text-danger">{errors.slugs}</p>}
        </div>
        <button type="submit" className="btn-primary" disabled={register.isPending}>Register the endpoint</button>
        {register.isError && !Object.keys(errors).length && <p role="alert" className="text-sm text-danger">{register.error.message}</p>}
      </form>
      {created && (
        <div role="status" className="space-y-1 rounded border border-ok bg-ok-bg p-3 text-sm">
          <p className="font-medium">Endpoint {created.id} registered. Its signing secret, shown this once:</p>
          <p className="flex items-center gap-2"><code className="break-all font-mono" data-testid="webhook-secret">{created.secret}</code>
            <button type="button" className="btn-quiet text-xs" onClick={() => { void navigator.clipboard?.writeText(created.secret); setCopied(true); }}>Copy</button>
            <span aria-live="polite" className="text-xs">{copied ? 'Copied' : ''}</span></p>
        </div>
      )}
      <QueryState query={list}>
        {(d) => d.items.length === 0 ? <p className="text-sm text-ink-soft">No endpoints yet.</p> : (
          <table className="table-plain">
            <caption className="sr-only">Your webhook endpoints</caption>
            <thead><tr><th>URL</th><th>Events</th><th>Follows</th><th>Delivered / pending / failed</th><th><span className="sr-only">Actions</span></th></tr></thead>
            <tbody>
              {d.items.map((e) => (
                <tr key={e.id}>
                  <td className="break-all font-mono text-xs">{e.url}</td>
                  <td className="text-xs">{e.events.join(', ')}</td>
                  <td className="text-xs">{e.slugs ? e.slugs.join(', ') : 'what your tokens evaluate'}</td>
                  <td className="font-mono text-xs">{e.deliveries.delivered} / {e.deliveries.pending} / {e.deliveries.failed}</td>
                  <td className="space-x-2 whitespace-nowrap text-xs">
                    <button type="button" className="text-brand-dark underline" onClick={() => setOpen(open === e.id ? null : e.id)} aria-expanded={open === e.id}>Delivery log</button>
                    <button type="button" className="text-danger underline" onClick={() => { if (window.confirm(`Delete the endpoint ${e.url}? Pending deliveries to it are dropped.`)) remove.mutate(e.id); }}>Delete</button>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </QueryState>
      {open !== null && <DeliveryLog id={open} />}
    </section>
  );
}

function DeliveryLog({ id }: { id: number }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ['webhook-deliveries', id], queryFn: () => api<Deliveries>(`/api/webhooks/${id}/deliveries`), refetchInterval: 3000 });
  const [note, setNote] = useState('');
  const replay = useMutation({
    mutationFn: (deliveryId: number) => api<{ id: number }>(`/api/webhooks/${id}/deliveries/${deliveryId}/replay`, { method: 'POST' }),
    onSuccess: (r, deliveryId) => { setNote(`Delivery ${deliveryId} queued again as ${r.id}.`); void qc.invalidateQueries({ queryKey: ['webhook-deliveries', id] }); void qc.invalidateQueries({ queryKey: ['webhooks'] }); },
  });
  const ping = useMutation({
    mutationFn: () => api<{ id: number }>(`/api/webhooks/${id}/ping`, { method: 'POST' }),
    onSuccess: (r) => { setNote(`Test delivery ${r.id} queued.`); void qc.invalidateQueries({ queryKey: ['webhook-deliveries', id] }); void qc.invalidateQueries({ queryKey: ['webhooks'] }); },
  });
  return (
    <div className="space-y-2 rounded border border-line p-3" aria-label={`Delivery log of endpoint ${id}`}>
      <div className="flex items-center justify-between"><h2 className="text-sm font-semibold">Delivery log, endpoint {id}</h2><button type="button" className="btn-quiet text-xs" onClick={() => ping.mutate()}>Send a test delivery</button></div>
      <p role="status" className="text-xs text-ok">{note}</p>
      <QueryState query={q}>
        {(d) => d.items.length === 0 ? <p className="text-sm text-ink-soft">Nothing sent yet.</p> : (
          <table className="table-plain text-xs">
            <caption className="sr-only">Deliveries, newest first</caption>
            <thead><tr><th>No.</th><th>Event</th><th>Status</th><th>Attempts</th><th>Last answer</th><th>Created</th><th><span className="sr-only">Actions</span></th></tr></thead>
            <tbody>
              {d.items.map((x) => (
                <tr key={x.id}>
                  <td className="font-mono">{x.id}{x.replayOf ? ` (again of ${x.replayOf})` : ''}</td>
                  <td>{x.event}</td>
                  <td>{x.status}{x.nextAttemptAt ? `, next try ${new Date(x.nextAttemptAt).toLocaleTimeString()}` : ''}</td>
                  <td className="font-mono">{x.attempts}</td>
                  <td>{x.lastStatus ?? ''} {x.lastError ?? ''}</td>
                  <td>{new Date(x.createdAt).toLocaleString()}</td>
                  <td><button type="button" className="text-brand-dark underline" onClick={() => replay.mutate(x.id)}>Send again</button></td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </QueryState>
    </div>
  );
}
