'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { Field } from '@/components/ui/field';
import { QueryState } from '@/components/ui/query-state';

const ROLES = ['admin', 'author', 'approver', 'engineer', 'integrator'] as const;
type Role = (typeof ROLES)[number];
interface UserRow { id: number; email: string; name: string; roles: Role[]; isActive: boolean; lockedUntil: string | null }

export function UsersAdmin() {
  const qc = useQueryClient();
  const users = useQuery({ queryKey: ['admin-users'], queryFn: () => api<{ items: UserRow[] }>('/api/admin/users') });
  const update = useMutation({
    mutationFn: (v: { id: number; roles?: Role[]; isActive?: boolean }) => api(`/api/admin/users/${v.id}`, { method: 'PATCH', body: { roles: v.roles, isActive: v.isActive } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['admin-users'] }),
  });

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_320px]">
      <section className="panel overflow-x-auto">
        <h1 className="mb-3 text-lg font-semibold">Users and roles</h1>
        {update.error && <p role="alert" className="mb-2 text-sm text-danger">{update.error.message}</p>}
        <QueryState query={users}>
          {(data) => (
            <table className="table-plain">
              <thead><tr><th>User</th>{ROLES.map((r) => <th key={r}>{r}</th>)}<th>Active</th></tr></thead>
              <tbody>
                {data.items.map((u) => (
                  <tr key={u.id}>
                    <td><div className="font-medium">{u.name}</div><div className="text-xs text-ink-faint">{u.email}</div></td>
                    {ROLES.map((r) => (
                      <td key={r}>
                        <input type="checkbox" aria-label={`${u.email} ${r}`} checked={u.roles.includes(r)}
                          onChange={(e) => {
                            const roles = e.target.checked ? [...u.roles, r] : u.roles.filter((x) => x !== r);
                            if (roles.length) update.mutate({ id: u.id, roles });
                          }} />
                      </td>
                    ))}
                    <td><input type="checkbox" aria-label={`${u.email} active`} checked={u.isActive} onChange={(e) => update.mutate({ id: u.id, isActive: e.target.checked })} /></td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </QueryState>
      </section>
      <NewUserForm onCreated={() => qc.invalidateQueries({ queryKey: ['admin-users'] })} />
    </div>
  );
}

function NewUserForm({ onCreated }: { onCreated: () => void }) {
  const [form, setForm] = useState({ email: '', name: '', password: '', roles: ['engineer'] as Role[] });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState('');
  const create = useMutation({
    mutationFn: () => api<{ email: string }>('/api/admin/users', { body: form }),
    onSuccess: (u) => { setDone(`Created ${u.email}.`); setErrors({}); setForm({ email: '', name: '', password: '', roles: ['engineer'] }); onCreated(); },
    onError: (e) => { setDone(''); setErrors(e instanceof ApiError ? { ...e.fieldErrors(), form: e.message } : { form: String(e) }); },
  });
  return (
    <form className="panel space-y-3" noValidate onSubmit={(e) => { e.preventDefault(); create.mutate(); }} aria-label="Create a user">
      <h2 className="font-semibold">Create a user</h2>
      {errors.form && <p role="alert" className="text-sm text-danger">{errors.form}</p>}
      {done && <p role="status" className="text-sm text-ok">{done}</p>}
      <Field label="E-mail" error={errors.email}>{(p) => <input {...p} className="field-input" value={form.email} onChange={(e) => setForm({ ...form, email: e.target.value })} />}</Field>
      <Field label="Name" error={errors.name}>{(p) => <input {...p} className="field-input" value={form.name} onChange={(e) => setForm({ ...form, name: e.target.value })} />}</Field>
      <Field label="Initial password" hint="At least 10 characters; ask the user to change it." error={errors.password}>{(p) => <input {...p} type="password" className="field-input" value={form.password} onChange={(e) => setForm({ ...form, password: e.target.value })} />}</Field>
      <fieldset>
        <legend className="text-sm font-medium">Roles</legend>
        <div className="mt-1 flex flex-wrap gap-3">
          {ROLES.map((r) => (
            <label key={r} className="flex items-center gap-1 text-sm">
              <input type="checkbox" checked={form.roles.includes(r)} onChange={(e) => setForm({ ...form, roles: e.target.checked ? [...form.roles, r] : form.roles.filter((x) => x !== r) })} />{r}
            </label>
          ))}
        </div>
        {errors.roles && <p className="text-xs text-danger">{errors.roles}</p>}
      </fieldset>
      <button className="btn-primary" disabled={create.isPending}>Create user</button>
    </form>
  );
}
