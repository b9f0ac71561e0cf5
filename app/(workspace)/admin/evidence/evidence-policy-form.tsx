'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import type { EvidencePolicy, Grade } from '@/lib/engine/evidence';

/** The approval policy on evidence: how many independent in-range checks, of how many kinds. */
export function EvidencePolicyForm() {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ['evidence-policy'], queryFn: () => api<{ policy: EvidencePolicy; grades: Record<Grade, string> }>('/api/admin/evidence-policy') });
  const [form, setForm] = useState({ minimumIndependent: '', minimumKinds: '' });
  useEffect(() => { if (q.data) setForm({ minimumIndependent: String(q.data.policy.minimumIndependent), minimumKinds: String(q.data.policy.minimumKinds) }); }, [q.data]);
  const save = useMutation({
    mutationFn: () => api('/api/admin/evidence-policy', { method: 'PUT', body: { minimumIndependent: Number(form.minimumIndependent), minimumKinds: Number(form.minimumKinds) } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['evidence-policy'] }),
  });
  const errors = save.error instanceof ApiError ? save.error.fieldErrors() : {};
  return (
    <QueryState query={q}>
      {(d) => (
        <form className="panel max-w-xl space-y-3" noValidate aria-label="Evidence policy" onSubmit={(e) => { e.preventDefault(); save.mutate(); }}>
          <h1 className="text-lg font-semibold">Evidence policy for approval</h1>
          <p className="text-sm text-ink-soft">A correlation version below this minimum can be approved only with a waiver the approver writes at signing. Transcriptions never count; memory never alone.</p>
          <div>
            <label htmlFor="min-independent" className="block text-sm font-medium">Independent in-range check cases, at least</label>
            <input id="min-independent" inputMode="numeric" className="field-input w-24" value={form.minimumIndependent} aria-invalid={Boolean(errors.minimumIndependent)} onChange={(e) => setForm({ ...form, minimumIndependent: e.target.value })} />
            {errors.minimumIndependent && <p className="text-xs text-danger">{errors.minimumIndependent}</p>}
          </div>
          <div>
            <label htmlFor="min-kinds" className="block text-sm font-medium">…of at least this many kinds</label>
            <input id="min-kinds" inputMode="numeric" className="field-input w-24" value={form.minimumKinds} aria-invalid={Boolean(errors.minimumKinds)} onChange={(e) => setForm({ ...form, minimumKinds: e.target.value })} />
            {errors.minimumKinds && <p className="text-xs text-danger">{errors.minimumKinds}</p>}
          </div>
          <button type="submit" className="btn-primary" disabled={save.isPending}>Save the policy</button>
          {save.isSuccess && <p role="status" className="text-sm text-ok">Policy saved; it applies to every sign-off from now on.</p>}
          {save.isError && !Object.keys(errors).length && <p role="alert" className="text-sm text-danger">{save.error.message}</p>}
          <dl className="space-y-1 text-xs">{Object.entries(d.grades).map(([g, m]) => <div key={g}><dt className="inline font-semibold">{g}:</dt> <dd className="inline">{m}</dd></div>)}</dl>
        </form>
      )}
    </QueryState>
  );
}
