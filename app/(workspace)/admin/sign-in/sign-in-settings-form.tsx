'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';

const ROLES = ['admin', 'author', 'approver', 'engineer', 'integrator'] as const;
type Role = (typeof ROLES)[number];
interface Settings { passwordSignIn: boolean; groupRoles: { group: string; role: Role }[]; providerConfigured: boolean; issuer: string | null; breakGlassEmail: string }

/** The company provider's groups and the Correlary role each gives; whether Correlary passwords are still accepted. */
export function SignInSettingsForm() {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ['sign-in-settings'], queryFn: () => api<Settings>('/api/admin/sign-in') });
  const [rows, setRows] = useState<{ group: string; role: Role }[]>([]);
  const [passwordSignIn, setPasswordSignIn] = useState(true);
  useEffect(() => { if (q.data) { setRows(q.data.groupRoles); setPasswordSignIn(q.data.passwordSignIn); } }, [q.data]);
  const save = useMutation({
    mutationFn: () => api('/api/admin/sign-in', { method: 'PUT', body: { passwordSignIn, groupRoles: rows } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['sign-in-settings'] }),
  });
  const errors = save.error instanceof ApiError ? save.error.fieldErrors() : {};
  return (
    <QueryState query={q}>
      {(d) => (
        <form className="panel max-w-3xl space-y-4" noValidate aria-label="Company sign-in" onSubmit={(e) => { e.preventDefault(); save.mutate(); }}>
          <h1 className="text-lg font-semibold">Company sign-in</h1>
          <p className="text-sm text-ink-soft">
            {d.providerConfigured
              ? <>People sign in with their company account at <code>{d.issuer}</code>. At every sign-in their roles are set from the groups below, so leaving a group loses the role at the next sign-in.</>
              : <>No company provider is configured (set <code>OIDC_ISSUER</code>, <code>OIDC_CLIENT_ID</code> and <code>OIDC_CLIENT_SECRET</code>); the mapping takes effect once one is.</>}
          </p>
          <table className="table-plain" aria-label="Groups and the roles they give">
            <thead><tr><th scope="col">Group at the provider</th><th scope="col">Correlary role</th><th scope="col"><span className="sr-only">Actions</span></th></tr></thead>
            <tbody>
              {rows.map((r, k) => (
                <tr key={k}>
                  <td>
                    <input aria-label={`Group ${k + 1}`} className="field-input font-mono" value={r.group} aria-invalid={Boolean(errors[`groupRoles.${k}.group`])} onChange={(e) => setRows(rows.map((x, j) => (j === k ? { ...x, group: e.target.value } : x)))} />
                    {errors[`groupRoles.${k}.group`] && <p className="text-xs text-danger">{errors[`groupRoles.${k}.group`]}</p>}
                  </td>
                  <td>
                    <select aria-label={`Role of group ${k + 1}`} className="field-input" value={r.role} onChange={(e) => setRows(rows.map((x, j) => (j === k ? { ...x, role: e.target.value as Role } : x)))}>
                      {ROLES.map((role) => <option key={role} value={role}>{role}</option>)}
                    </select>
                  </td>
                  <td><button type="button" className="btn-quiet px-2 py-1 text-xs" aria-label={`Remove group ${r.group || k + 1}`} onClick={() => setRows(rows.filter((_, j) => j !== k))}>Remove</button></td>
                </tr>
              ))}
            </tbody>
          </table>
          <button type="button" className="btn-quiet" onClick={() => setRows([...rows, { group: '', role: 'engineer' }])}>Add a group</button>
          <label className="flex items-start gap-2 text-sm">
            <input type="checkbox" className="mt-1" checked={passwordSignIn} onChange={(e) => setPasswordSignIn(e.target.checked)} />
            <span>Accept Correlary passwords too. Unticked, only the break-glass admin (<code>{d.breakGlassEmail}</code>) may still sign in with a password.</span>
          </label>
          <button type="submit" className="btn-primary" disabled={save.isPending}>Save sign-in settings</button>
          {save.isSuccess && <p role="status" className="text-sm text-ok">Saved; it applies from each person&apos;s next sign-in.</p>}
          {save.isError && !Object.keys(errors).length && <p role="alert" className="text-sm text-danger">{save.error.message}</p>}
        </form>
      )}
    </QueryState>
  );
}
