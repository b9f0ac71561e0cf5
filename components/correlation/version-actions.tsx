'use client';

import Link from 'next/link';
import { CompanySignature, useCompanySignature, useDraftAcrossSignIn } from '@/components/review/company-signature';
import { useRouter } from 'next/navigation';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import type { VersionDetail, Viewer } from './types';

interface Uses {
  calculations: { id: number; title: string; project: string }[];
  templates: { slug: string; title: string; version: number; status: string }[];
  evaluations: { name: string; evaluations: number; viaToken: boolean }[];
}

/** "What uses this version", shown before a withdrawal is confirmed. */
function UsesSummary({ uses, loading }: { uses?: Uses; loading: boolean }) {
  if (loading || !uses) return <p className="text-sm text-ink-soft" role="status">Looking up what uses this version…</p>;
  const none = !uses.calculations.length && !uses.templates.length && !uses.evaluations.length;
  return (
    <div className="space-y-1 text-sm" data-testid="version-uses">
      <p className="font-medium">What uses this version</p>
      {none && <p>Nothing yet: no saved calculation, template or evaluation.</p>}
      {uses.calculations.length > 0 && <div><p>{uses.calculations.length} saved calculation{uses.calculations.length === 1 ? '' : 's'} (they will be flagged):</p><ul className="list-disc pl-5">{uses.calculations.map((c) => <li key={c.id}><Link className="underline" href={`/calculations/${c.id}`}>{c.title}</Link> — {c.project}</li>)}</ul></div>}
      {uses.templates.length > 0 && <div><p>{uses.templates.length} calculation template version{uses.templates.length === 1 ? '' : 's'} pin it:</p><ul className="list-disc pl-5">{uses.templates.map((t) => <li key={`${t.slug}${t.version}`}>{t.title} v{t.version} ({t.status.replace('_', ' ')})</li>)}</ul></div>}
      {uses.evaluations.length > 0 && <p>Evaluated by {uses.evaluations.map((e) => `${e.name} (${e.evaluations}${e.viaToken ? ', API' : ''})`).join(', ')}.</p>}
    </div>
  );
}

export function VersionActions({ detail, user }: { detail: VersionDetail; user: Viewer }) {
  const router = useRouter();
  const qc = useQueryClient();
  const [reason, setReason] = useState('');
  const [password, setPassword] = useState('');
  const [open, setOpen] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  const signature = useCompanySignature();
  const keepDraft = useDraftAcrossSignIn(`withdraw:${detail.slug}:${detail.version}`, { reason }, (d) => { setReason(d.reason); setOpen(true); });
  const isAuthor = user.roles.includes('author');
  const isApprover = user.roles.includes('approver');
  const newVersion = useMutation({
    mutationFn: () => api<{ version: number }>(`/api/correlations/${detail.slug}/versions`, { body: { fromVersion: detail.version } }),
    onSuccess: (r) => router.push(`/author/${detail.slug}/${r.version}`),
  });
  const withdraw = useMutation({
    mutationFn: () => api<{ notified: string[] }>(`/api/correlations/${detail.slug}/versions/${detail.version}/withdraw`, { body: { reason, password } }),
    onSuccess: async (r) => {
      setOpen(false);
      setPassword('');
      setDone(`Version ${detail.version} is withdrawn with your signature. ${r.notified.length ? `${r.notified.length} ${r.notified.length === 1 ? 'person was' : 'people were'} told by e-mail` : 'Nobody had used it'}; saved calculations that used it are flagged.`);
      await Promise.all([qc.invalidateQueries({ queryKey: ['version', detail.slug] }), qc.invalidateQueries({ queryKey: ['correlation', detail.slug] })]);
    },
  });
  const uses = useQuery({ queryKey: ['uses', detail.slug, detail.version], enabled: open, queryFn: () => api<Uses>(`/api/correlations/${detail.slug}/versions/${detail.version}/uses`) });
  const fieldErrors = withdraw.error instanceof ApiError ? withdraw.error.fieldErrors() : {};
  const reasonError = fieldErrors.reason;
  const passwordError = fieldErrors.password;

  return (
    <div className="flex flex-wrap items-start gap-2">
      {isAuthor && detail.status === 'draft' && detail.authorId === user.id && <Link href={`/author/${detail.slug}/${detail.version}`} className="btn-primary">Edit this draft</Link>}
      {isAuthor && detail.status !== 'draft' && <button type="button" className="btn-quiet" disabled={newVersion.isPending} onClick={() => newVersion.mutate()}>Start a new version from v{detail.version}</button>}
      {isApprover && detail.status === 'in_review' && detail.authorId !== user.id && <Link href={`/review/${detail.slug}/${detail.version}`} className="btn-primary">Review this version</Link>}
      {isApprover && detail.status === 'approved' && !open && <button type="button" className="btn-quiet text-danger" onClick={() => { setDone(null); setOpen(true); }}>Withdraw…</button>}
      {newVersion.isError && <p role="alert" className="text-sm text-danger">{newVersion.error.message}</p>}
      {done && <p role="status" className="w-full rounded bg-ok-bg px-3 py-2 text-sm text-ok">{done}</p>}
      {open && (
        <form className="w-full max-w-xl space-y-2 rounded border border-danger/30 bg-danger-bg p-3" onSubmit={(e) => { e.preventDefault(); withdraw.mutate(); }}>
          <UsesSummary uses={uses.data} loading={uses.isPending} />
          <label htmlFor="withdraw-reason" className="block text-sm font-medium">Reason for withdrawal (sent to everyone who used this version)</label>
          <textarea id="withdraw-reason" className="field-input" rows={3} value={reason} aria-invalid={Boolean(reasonError)} aria-describedby={reasonError ? 'withdraw-reason-error' : undefined} onChange={(e) => setReason(e.target.value)} />
          {reasonError && <p id="withdraw-reason-error" className="text-xs text-danger">{reasonError}</p>}
          {signature.company ? <CompanySignature fresh={signature.fresh} authAt={signature.authAt} error={passwordError} beforeLeaving={keepDraft} what="the withdrawal" /> : <>
            <label htmlFor="withdraw-password" className="block text-sm font-medium">Your password, to sign the withdrawal</label>
            <input id="withdraw-password" type="password" autoComplete="current-password" className="field-input max-w-xs" value={password} aria-invalid={Boolean(passwordError)} aria-describedby={passwordError ? 'withdraw-password-error' : undefined} onChange={(e) => setPassword(e.target.value)} />
            {passwordError && <p id="withdraw-password-error" className="text-xs text-danger">{passwordError}</p>}
          </>}
          {withdraw.isError && !reasonError && !passwordError && <p role="alert" className="text-xs text-danger">{withdraw.error?.message}</p>}
          <div className="flex gap-2"><button className="btn-danger" disabled={withdraw.isPending}>Withdraw version {detail.version}</button><button type="button" className="btn-quiet" onClick={() => setOpen(false)}>Cancel</button></div>
        </form>
      )}
    </div>
  );
}
