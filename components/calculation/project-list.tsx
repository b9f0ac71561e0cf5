'use client';

import Link from 'next/link';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import type { ProjectSummary } from './types';

/** Projects the user can read, with a flag count, and a form to start one. */
export function ProjectList({ canCreate }: { canCreate: boolean }) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ['projects'], queryFn: () => api<{ items: ProjectSummary[] }>('/api/projects') });
  const [name, setName] = useState('');
  const [description, setDescription] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const create = useMutation({
    mutationFn: () => api<{ id: number }>('/api/projects', { body: { name, description } }),
    onSuccess: () => { setName(''); setDescription(''); setErrors({}); void qc.invalidateQueries({ queryKey: ['projects'] }); },
    onError: (e) => setErrors(e instanceof ApiError ? e.fieldErrors() : {}),
  });
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <h1 className="text-xl font-semibold">Calculations</h1>
          <p className="text-sm text-ink-soft">Saved, traceable calculations grouped by project. Start one from a <Link className="text-brand-dark underline" href="/templates">calculation template</Link>.</p>
        </div>
      </div>
      <QueryState query={q}>
        {(d) => d.items.length === 0 ? <p className="text-sm">No project you can see yet.</p> : (
          <table className="table-plain" aria-label="Projects">
            <thead><tr><th scope="col">project</th><th scope="col">owner</th><th scope="col">calculations</th><th scope="col">flagged</th><th scope="col">you may</th></tr></thead>
            <tbody>
              {d.items.map((p) => (
                <tr key={p.id}>
                  <td><Link className="font-medium text-brand-dark underline" href={`/projects/${p.id}`}>{p.name}</Link><p className="text-xs text-ink-soft">{p.description}</p></td>
                  <td>{p.owner}</td><td>{p.calculations}</td>
                  <td>{p.flagged ? <span className="rounded bg-danger-bg px-1.5 text-danger">{p.flagged} use a withdrawn version</span> : '—'}</td>
                  <td className="text-xs">{p.canEdit ? 'edit' : 'read'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </QueryState>
      {canCreate && (
        <form className="panel max-w-xl space-y-2" noValidate onSubmit={(e) => { e.preventDefault(); create.mutate(); }} aria-label="New project">
          <h2 className="font-semibold">New project</h2>
          <div>
            <label htmlFor="project-name" className="block text-sm font-medium">Name</label>
            <input id="project-name" className="field-input" value={name} onChange={(e) => setName(e.target.value)} aria-invalid={Boolean(errors.name)} placeholder="e.g. Pump skid enclosure, revision B" />
            {errors.name && <p className="text-xs text-danger">{errors.name}</p>}
          </div>
          <div>
            <label htmlFor="project-description" className="block text-sm font-medium">Description</label>
            <input id="project-description" className="field-input" value={description} onChange={(e) => setDescription(e.target.value)} />
          </div>
          <button className="btn-primary" type="submit" disabled={create.isPending}>Create project</button>
          {create.isSuccess && <p role="status" className="text-sm text-ok">Project created.</p>}
          {create.isError && !Object.keys(errors).length && <p role="alert" className="text-sm text-danger">{create.error.message}</p>}
        </form>
      )}
    </div>
  );
}
