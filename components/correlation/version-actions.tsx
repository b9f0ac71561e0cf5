'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import type { VersionDetail, Viewer } from './types';

export function VersionActions({ detail, user }: { detail: VersionDetail; user: Viewer }) {
  const router = useRouter();
  const qc = useQueryClient();
  const [reason, setReason] = useState('');
  const [open, setOpen] = useState(false);
  const isAuthor = user.roles.includes('author');
  const isApprover = user.roles.includes('approver');
  const newVersion = useMutation({
    mutationFn: () => api<{ version: number }>(`/api/correlations/${detail.slug}/versions`, { body: { fromVersion: detail.version } }),
    onSuccess: (r) => router.push(`/author/${detail.slug}/${r.version}`),
  });
  const withdraw = useMutation({
    mutationFn: () => api(`/api/correlations/${detail.slug}/versions/${detail.version}/withdraw`, { body: { reason } }),
    onSuccess: () => { setOpen(false); qc.invalidateQueries({ queryKey: ['version', detail.slug] }); qc.invalidateQueries({ queryKey: ['correlation', detail.slug] }); },
  });
  const reasonError = withdraw.error instanceof ApiError ? withdraw.error.fieldErrors().reason : undefined;

  return (
    <div className="flex flex-wrap items-start gap-2">
      {isAuthor && detail.status === 'draft' && detail.authorId === user.id && <Link href={`/author/${detail.slug}/${detail.version}`} className="btn-primary">Edit this draft</Link>}
      {isAuthor && detail.status !== 'draft' && <button type="button" className="btn-quiet" disabled={newVersion.isPending} onClick={() => newVersion.mutate()}>Start a new version from v{detail.version}</button>}
      {isApprover && detail.status === 'in_review' && detail.authorId !== user.id && <Link href={`/review/${detail.slug}/${detail.version}`} className="btn-primary">Review this version</Link>}
      {isApprover && detail.status === 'approved' && !open && <button type="button" className="btn-quiet text-danger" onClick={() => setOpen(true)}>Withdraw…</button>}
      {newVersion.isError && <p role="alert" className="text-sm text-danger">{newVersion.error.message}</p>}
      {open && (
        <form className="w-full max-w-xl space-y-2 rounded border border-danger/30 bg-danger-bg p-3" onSubmit={(e) => { e.preventDefault(); withdraw.mutate(); }}>
          <label htmlFor="withdraw-reason" className="block text-sm font-medium">Reason for withdrawal (sent to everyone who used this version)</label>
          <textarea id="withdraw-reason" className="field-input" rows={3} value={reason} aria-invalid={Boolean(reasonError)} onChange={(e) => setReason(e.target.value)} />
          {(reasonError || (withdraw.isError && !reasonError)) && <p className="text-xs text-danger">{reasonError ?? withdraw.error?.message}</p>}
          <div className="flex gap-2"><button className="btn-danger" disabled={withdraw.isPending}>Withdraw version {detail.version}</button><button type="button" className="btn-quiet" onClick={() => setOpen(false)}>Cancel</button></div>
        </form>
      )}
    </div>
  );
}
