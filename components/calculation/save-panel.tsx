'use client';

import { useMutation, useQuery } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import type { ProjectSummary } from './types';

/** Saves the current run (the server runs it again and freezes it) into a project the user may edit. */
export function SavePanel({ body, defaultTitle, label = 'Save calculation' }: { body: () => Record<string, unknown> | null; defaultTitle: string; label?: string }) {
  const router = useRouter();
  const projects = useQuery({ queryKey: ['projects'], queryFn: () => api<{ items: ProjectSummary[] }>('/api/projects') });
  const editable = (projects.data?.items ?? []).filter((p) => p.canEdit);
  const [project, setProject] = useState<string>('');
  const [title, setTitle] = useState(defaultTitle);
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const save = useMutation({
    mutationFn: (b: Record<string, unknown>) => api<{ id: number; revision: number }>('/api/calculations', { body: b }),
    onSuccess: (r) => router.push(`/calculations/${r.id}?saved=1`),
    onError: (e) => setErrors(e instanceof ApiError ? e.fieldErrors() : {}),
  });
  const chosen = project || String(editable[0]?.id ?? '');
  function submit(e: React.FormEvent) {
    e.preventDefault();
    const b = body();
    const errs: Record<string, string> = {};
    if (!chosen) errs.project = 'Choose a project (or create one under Calculations)';
    if (title.trim().length < 2) errs.title = 'Give the calculation a title';
    setErrors(errs);
    if (b && !Object.keys(errs).length) save.mutate({ ...b, project: Number(chosen), title, ...(note.trim() ? { note } : {}) });
  }
  return (
    <form onSubmit={submit} noValidate className="panel space-y-2" aria-label="Save">
      <h2 className="font-semibold">Save to a project</h2>
      <div>
        <label htmlFor="save-project" className="block text-sm font-medium">Project</label>
        <select id="save-project" className="field-input" value={chosen} onChange={(e) => setProject(e.target.value)} aria-invalid={Boolean(errors.project)}>
          {editable.length === 0 && <option value="">no project you may edit</option>}
          {editable.map((p) => <option key={p.id} value={p.id}>{p.name}</option>)}
        </select>
        {errors.project && <p className="text-xs text-danger">{errors.project}</p>}
      </div>
      <div>
        <label htmlFor="save-title" className="block text-sm font-medium">Title</label>
        <input id="save-title" className="field-input" value={title} onChange={(e) => setTitle(e.target.value)} aria-invalid={Boolean(errors.title)} />
        {errors.title && <p className="text-xs text-danger">{errors.title}</p>}
      </div>
      <div>
        <label htmlFor="save-note" className="block text-sm font-medium">Note <span className="font-normal text-ink-soft">(optional: design point, assumption)</span></label>
        <input id="save-note" className="field-input" value={note} onChange={(e) => setNote(e.target.value)} />
      </div>
      <button type="submit" className="btn-primary" disabled={save.isPending}>{save.isPending ? 'Saving…' : label}</button>
      {save.isError && <p role="alert" className="rounded bg-danger-bg px-2 py-1 text-sm text-danger">{save.error.message}</p>}
    </form>
  );
}
