'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useMutation, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { StatusBadge } from '@/components/ui/status-badge';
import { Field } from '@/components/ui/field';
import { CATEGORIES, CATEGORY_LABELS } from '@/lib/engine/types';


/** A schema-valid starting point; the author replaces the placeholder input, output and reference. */
function starter(title: string, category: string, situation: string) {
  return {
    schemaVersion: 1, title, summary: 'Describe what the correlation computes and for which situation.', category, situation, tags: [],
    inputs: [{ symbol: 'Re_D', name: 'Reynolds number', unit: '1' }],
    outputs: [{ symbol: 'Nu_D', name: 'average Nusselt number', unit: '1', expression: '0.3 * Re_D^0.5' }],
    validity: [{ symbol: 'Re_D', min: 1, max: 1e5 }],
    references: [{ citation: 'Author, A. (year) Title, Journal volume:pages', locator: 'equation number' }],
    propertyBasis: 'Film temperature',
  };
}

export function AuthorHome() {
  const router = useRouter();
  const work = useQuery({ queryKey: ['my-work'], queryFn: () => api<{ items: { slug: string; title: string; version: number; status: string; updatedAt: string }[] }>('/api/my-work') });
  const [form, setForm] = useState({ slug: '', title: '', category: 'external-flow', situation: '' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const create = useMutation({
    mutationFn: () => api<{ slug: string; version: number }>('/api/correlations', { body: { slug: form.slug.trim(), definition: starter(form.title.trim(), form.category, form.situation.trim()), checkCases: [] } }),
    onSuccess: (r) => router.push(`/author/${r.slug}/${r.version}`),
    onError: (e) => {
      if (!(e instanceof ApiError)) { setErrors({ form: String(e) }); return; }
      const f = e.fieldErrors();
      setErrors({ form: e.message, slug: f.slug, title: f['definition/title'], situation: f['definition/situation'] });
    },
  });

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const next: Record<string, string> = {};
    if (!/^[a-z0-9]+(?:-[a-z0-9]+)*$/.test(form.slug.trim())) next.slug = 'Lower-case words joined by hyphens, e.g. duct-rectangular-laminar';
    if (form.title.trim().length < 3) next.title = 'At least 3 characters';
    if (form.situation.trim().length < 2) next.situation = 'Name the physical situation, e.g. rectangular duct';
    setErrors(next);
    if (!Object.keys(next).length) create.mutate();
  }

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_360px]">
      <section className="panel">
        <h2 className="mb-2 font-semibold">Drafts, versions in review and returned versions</h2>
        <QueryState query={work}>
          {(d) => d.items.length === 0 ? <p className="text-sm text-ink-faint">Nothing open. Start a correlation, or open one in the library and start a new version.</p> : (
            <table className="table-plain">
              <thead><tr><th>Correlation</th><th>Version</th><th>Status</th><th>Changed</th></tr></thead>
              <tbody>{d.items.map((w) => (
                <tr key={`${w.slug}-${w.version}`}>
                  <td><Link className="text-brand-dark hover:underline" href={w.status === 'draft' ? `/author/${w.slug}/${w.version}` : `/correlations/${w.slug}/versions/${w.version}`}>{w.title}</Link><div className="font-mono text-xs text-ink-faint">{w.slug}</div></td>
                  <td className="font-mono">v{w.version}</td><td><StatusBadge status={w.status} /></td><td className="text-xs">{w.updatedAt.slice(0, 16).replace('T', ' ')}</td>
                </tr>
              ))}</tbody>
            </table>
          )}
        </QueryState>
      </section>
      <form className="panel space-y-3" noValidate onSubmit={submit} aria-label="New correlation">
        <h2 className="font-semibold">New correlation</h2>
        {errors.form && !errors.slug && <p role="alert" className="text-sm text-danger">{errors.form}</p>}
        <Field label="Slug (stable public identifier)" error={errors.slug} hint="e.g. duct-rectangular-laminar">{(p) => <input {...p} className="field-input font-mono" value={form.slug} onChange={(e) => setForm({ ...form, slug: e.target.value })} />}</Field>
        <Field label="Title" error={errors.title}>{(p) => <input {...p} className="field-input" value={form.title} onChange={(e) => setForm({ ...form, title: e.target.value })} />}</Field>
        <Field label="Category">{(p) => <select {...p} className="field-input" value={form.category} onChange={(e) => setForm({ ...form, category: e.target.value })}>{CATEGORIES.map((c) => <option key={c} value={c}>{CATEGORY_LABELS[c]}</option>)}</select>}</Field>
        <Field label="Situation" error={errors.situation} hint="Correlations with the same situation can be compared">{(p) => <input {...p} className="field-input" value={form.situation} onChange={(e) => setForm({ ...form, situation: e.target.value })} />}</Field>
        <button className="btn-primary" disabled={create.isPending}>Create draft</button>
      </form>
    </div>
  );
}
