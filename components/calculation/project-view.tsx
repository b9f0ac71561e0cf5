'use client';

import Link from 'next/link';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';

interface Project {
  id: number; name: string; description: string; owner: string; access: { read: boolean; edit: boolean; manage: boolean };
  members: { userId: number; name: string; role: string }[];
  calculations: { id: number; title: string; revision: number; owner: string; updatedAt: string; template: { slug: string; version: number; title: string } | null; parametric: boolean; flags: { slug: string; version: number; reason: string | null }[] }[];
}

export function ProjectView({ id }: { id: number }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ['project', id], queryFn: () => api<Project>(`/api/projects/${id}`) });
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<'editor' | 'reviewer'>('editor');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const member = useMutation({
    mutationFn: (b: { email: string; role: string | null }) => api(`/api/projects/${id}/members`, { body: b }),
    onSuccess: () => { setEmail(''); setErrors({}); void qc.invalidateQueries({ queryKey: ['project', id] }); },
    onError: (e) => setErrors(e instanceof ApiError ? e.fieldErrors() : {}),
  });
  return (
    <QueryState query={q}>
      {(p) => {
        const flagged = p.calculations.filter((c) => c.flags.length);
        return (
          <div className="space-y-4">
            <div>
              <p className="text-xs text-ink-soft"><Link className="underline" href="/projects">Calculations</Link> / project</p>
              <h1 className="text-xl font-semibold">{p.name}</h1>
              <p className="text-sm text-ink-soft">{p.description} · owner {p.owner}</p>
            </div>
            {flagged.length > 0 && (
              <p role="alert" className="rounded border border-danger/40 bg-danger-bg px-3 py-2 text-sm text-danger">
                <strong>{flagged.length} calculation{flagged.length === 1 ? '' : 's'}</strong> used a version that has since been withdrawn: review {flagged.length === 1 ? 'it' : 'them'} before the results go further.
              </p>
            )}
            <table className="table-plain" aria-label="Calculations">
              <thead><tr><th scope="col">calculation</th><th scope="col">from</th><th scope="col">revision</th><th scope="col">owner</th><th scope="col">saved</th><th scope="col">status</th></tr></thead>
              <tbody>
                {p.calculations.map((c) => (
                  <tr key={c.id} className={c.flags.length ? 'bg-danger-bg' : ''}>
                    <td><Link className="font-medium text-brand-dark underline" href={`/calculations/${c.id}`}>{c.title}</Link>{c.parametric && <span className="ml-2 text-xs text-ink-soft">table of cases</span>}</td>
                    <td className="text-xs">{c.template ? <Link className="underline" href={`/templates/${c.template.slug}`}>{c.template.title} v{c.template.version}</Link> : 'own chain'}</td>
                    <td>{c.revision}</td><td>{c.owner}</td><td className="text-xs">{c.updatedAt.slice(0, 16).replace('T', ' ')}</td>
                    <td className="text-xs">{c.flags.length ? <span className="font-medium text-danger" data-testid="calc-flag">⚑ uses withdrawn {c.flags.map((f) => `${f.slug} v${f.version}`).join(', ')}</span> : 'current'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            {p.calculations.length === 0 && <p className="text-sm">No calculations yet: start one from a <Link className="text-brand-dark underline" href="/templates">template</Link>.</p>}
            <section className="panel max-w-xl space-y-2" aria-label="Members">
              <h2 className="font-semibold">Members</h2>
              <p className="text-xs text-ink-soft">Editors may save calculations here; reviewers read. Approvers and admins may read every project.</p>
              <ul className="text-sm">{p.members.map((m) => <li key={m.userId}>{m.name} — {m.role}</li>)}</ul>
              {p.access.manage && (
                <form className="flex flex-wrap items-end gap-2" noValidate onSubmit={(e) => { e.preventDefault(); member.mutate({ email, role }); }}>
                  <div className="grow">
                    <label htmlFor="member-email" className="block text-sm font-medium">E-mail</label>
                    <input id="member-email" className="field-input" value={email} onChange={(e) => setEmail(e.target.value)} aria-invalid={Boolean(errors.email)} />
                    {errors.email && <p className="text-xs text-danger">{errors.email}</p>}
                  </div>
                  <div>
                    <label htmlFor="member-role" className="block text-sm font-medium">Role</label>
                    <select id="member-role" className="field-input" value={role} onChange={(e) => setRole(e.target.value as 'editor' | 'reviewer')}><option value="editor">editor</option><option value="reviewer">reviewer</option></select>
                  </div>
                  <button className="btn-quiet" type="submit">Add or change</button>
                </form>
              )}
              {member.isSuccess && <p role="status" className="text-sm text-ok">Members updated.</p>}
            </section>
          </div>
        );
      }}
    </QueryState>
  );
}
