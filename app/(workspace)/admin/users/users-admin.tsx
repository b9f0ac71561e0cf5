'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { Field } from '@/components/ui/field';
import { QueryState } from '@/components/ui/query-state';

const ROLES = ['admin', 'author', 'approver', 'engineer', 'integrator'] as const;
type Role = (typeof ROLES)[number];
interface UserRow { id: number; email: string; name: string; roles: Role[]; isActive: boolean; lockedUntil: string | null }

const ROLE_MEANING: Record<Role, string> = {
  admin: 'users, tokens, audit trail, policies',
  author: 'writes correlations and templates',
  approver: 'signs versions off, withdraws them',
  engineer: 'evaluates and keeps calculations',
  integrator: 'calls the API with tokens',
};

/**
 * Roles and activity per user. Changes to a row are staged and saved with the row's button, then confirmed in
 * words; an admin cannot remove their own admin role or deactivate themselves (the server refuses it too).
 */
export function UsersAdmin({ meId }: { meId: number }) {
  const qc = useQueryClient();
  const users = useQuery({ queryKey: ['admin-users'], queryFn: () => api<{ items: UserRow[] }>('/api/admin/users') });
  const [staged, setStaged] = useState<Record<number, { roles: Role[]; isActive: boolean }>>({});
  const [saved, setSaved] = useState<string | null>(null);
  const update = useMutation({
    mutationFn: (v: { user: UserRow; roles: Role[]; isActive: boolean }) => api(`/api/admin/users/${v.user.id}`, { method: 'PATCH', body: { roles: v.roles, isActive: v.isActive } }).then(() => v),
    onSuccess: async (v) => {
      setStaged(({ [v.user.id]: _, ...rest }) => rest);
      const ended = v.roles.join() !== v.user.roles.join() || v.isActive !== v.user.isActive;
      setSaved(`Saved ${v.user.name}: ${v.isActive ? `roles ${v.roles.join(', ')}` : 'deactivated, API tokens revoked'}.${ended ? ' Their open sessions ended; the change applies at their next sign-in.' : ''}`);
      await qc.invalidateQueries({ queryKey: ['admin-users'] });
    },
    onError: () => setSaved(null),
  });

  const current = (u: UserRow) => staged[u.id] ?? { roles: u.roles, isActive: u.isActive };
  const stage = (u: UserRow, patch: Partial<{ roles: Role[]; isActive: boolean }>) => { setSaved(null); setStaged({ ...staged, [u.id]: { ...current(u), ...patch } }); };
  const changed = (u: UserRow) => { const c = staged[u.id]; return Boolean(c) && (c.isActive !== u.isActive || [...c.roles].sort().join() !== [...u.roles].sort().join()); };

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_320px]">
      <section className="panel overflow-x-auto">
        <h1 className="mb-1 text-lg font-semibold">Users and roles</h1>
        <p className="mb-3 text-sm text-ink-soft">Tick the roles of a user, then save the row. A change of roles ends the person’s open sessions; deactivation also revokes their API tokens for good.</p>
        {update.error && <p role="alert" className="mb-2 rounded bg-danger-bg px-3 py-2 text-sm text-danger">{update.error.message}</p>}
        {saved && <p role="status" className="mb-2 rounded bg-ok-bg px-3 py-2 text-sm text-ok">{saved}</p>}
        <QueryState query={users}>
          {(data) => (
            <table className="table-plain">
              <thead><tr><th>User</th>{ROLES.map((r) => <th key={r} title={ROLE_MEANING[r]}>{r}</th>)}<th>Active</th><th><span className="sr-only">Save</span></th></tr></thead>
              <tbody>
                {data.items.map((u) => {
                  const c = current(u);
                  const me = u.id === meId;
                  return (
                    <tr key={u.id} className={changed(u) ? 'bg-caution-bg/50' : ''}>
                      <td><div className="font-medium">{u.name}{me && <span className="ml-1 text-xs font-normal text-ink-soft">(you)</span>}</div><div className="text-xs text-ink-soft">{u.email}</div></td>
                      {ROLES.map((r) => {
                        const locked = me && r === 'admin';
                        return (
                          <td key={r}>
                            <input type="checkbox" aria-label={`${u.email} ${r}`} checked={c.roles.includes(r)} disabled={locked}
                              title={locked ? 'You cannot remove your own admin role; another admin can.' : ROLE_MEANING[r]}
                              onChange={(e) => stage(u, { roles: e.target.checked ? [...c.roles, r] : c.roles.filter((x) => x !== r) })} />
                          </td>
                        );
                      })}
                      <td><input type="checkbox" aria-label={`${u.email} active`} checked={c.isActive} disabled={me} title={me ? 'You cannot deactivate yourself.' : undefined} onChange={(e) => stage(u, { isActive: e.target.checked })} /></td>
                      <td className="whitespace-nowrap">
                        {changed(u) && (
                          <span className="inline-flex gap-1">
                            <button type="button" className="btn-primary px-2 py-1 text-xs" disabled={update.isPending || c.roles.length === 0}
                              onClick={() => update.mutate({ user: u, roles: c.roles, isActive: c.isActive })}>Save {u.name.split(' ')[0]}</button>
                            <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => setStaged(({ [u.id]: _, ...rest }) => rest)}>Undo</button>
                          </span>
                        )}
                        {changed(u) && c.roles.length === 0 && <p className="text-xs text-danger">Keep at least one role.</p>}
                      </td>
                    </tr>
                  );
                })}
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
