'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useMutation, useQuery } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { StatusBadge } from '@/components/ui/status-badge';
import { Field } from '@/components/ui/field';
import { CATEGORIES, CATEGORY_LABELS } from '@/lib/engine/types';
import { checkExpression, symbolsRead, toTex } from '@/lib/engine/expressions';
import { symbolTex } from '@/lib/engine/tex-symbols';
import { Tex } from '@/components/ui/tex';
import { Sym } from '@/components/ui/sym';


interface WorkItem { slug: string; title: string; version: number; status: string; updatedAt: string; returnedBy?: string; returnComment?: string; nextDraft?: number }

interface NewForm {
  slug: string; title: string; summary: string; category: string; situation: string;
  output: { symbol: string; name: string; unit: string; expression: string };
  inputs: Record<string, { name: string; unit: string }>;
  citation: string; locator: string;
}

/**
 * A new correlation starts from what the author knows — its formula and its source — not from boilerplate: the
 * inputs are the symbols the formula reads, each named and given a unit here; everything else is added in the
 * draft's form afterwards.
 */
export function AuthorHome() {
  const router = useRouter();
  const work = useQuery({ queryKey: ['my-work'], queryFn: () => api<{ items: WorkItem[] }>('/api/my-work') });
  const [form, setForm] = useState<NewForm>({ slug: '', title: '', summary: '', category: 'external-flow', situation: '', output: { symbol: '', name: '', unit: '1', expression: '' }, inputs: {}, citation: '', locator: '' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const read = useMemo(() => (form.output.expression.trim() ? symbolsRead(form.output.expression) : { symbols: [] as string[] }), [form.output.expression]);
  const definition = () => ({
    schemaVersion: 1, title: form.title.trim(), summary: form.summary.trim(), category: form.category, situation: form.situation.trim(), tags: [],
    inputs: read.symbols.map((s) => ({ symbol: s, name: form.inputs[s]?.name.trim() ?? '', unit: form.inputs[s]?.unit.trim() || '1' })),
    outputs: [{ symbol: form.output.symbol.trim(), name: form.output.name.trim(), unit: form.output.unit.trim() || '1', expression: form.output.expression.trim() }],
    references: [{ citation: form.citation.trim(), ...(form.locator.trim() ? { locator: form.locator.trim() } : {}) }],
  });
  const create = useMutation({
    mutationFn: () => api<{ slug: string; version: number }>('/api/correlations', { body: { slug: form.slug.trim(), definition: definition(), checkCases: [] } }),
    onSuccess: (r) => router.push(`/author/${r.slug}/${r.version}?created=1`),
    onError: (e) => {
      if (!(e instanceof ApiError)) { setErrors({ form: String(e) }); return; }
      const f = e.fieldErrors();
      const byField: Record<string, string> = { form: e.message };
      for (const [path, message] of Object.entries(f)) byField[path.replace(/^definition\//, '')] = message;
      setErrors(byField);
    },
  });
  const setInput = (s: string, patch: Partial<{ name: string; unit: string }>) => setForm({ ...form, inputs: { ...form.inputs, [s]: { ...(form.inputs[s] ?? { name: '', unit: '1' }), ...patch } } });

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const next: Record<string, string> = {};
    if (!/^[a-z0-9]+(?:-[a-z0-9]+)*$/.test(form.slug.trim())) next.slug = 'Lower-case words joined by hyphens, e.g. duct-rectangular-laminar';
    if (form.title.trim().length < 3) next.title = 'At least 3 characters';
    if (form.summary.trim().length < 3) next.summary = 'Say in a sentence what it gives and where';
    if (form.situation.trim().length < 2) next.situation = 'Name the physical situation, e.g. rectangular duct';
    if (!/^[A-Za-z][A-Za-z0-9_]*$/.test(form.output.symbol.trim())) next['outputs/0/symbol'] = 'A symbol such as Nu_D: a letter, then letters, digits or _';
    if (!form.output.name.trim()) next['outputs/0/name'] = 'Name the result, e.g. average Nusselt number';
    if (!form.output.expression.trim()) next['outputs/0/expression'] = 'Write the formula';
    else if (read.error) next['outputs/0/expression'] = read.error;
    else if (!read.symbols.length) next['outputs/0/expression'] = 'The formula reads no input';
    for (const s of read.symbols) if (!form.inputs[s]?.name.trim()) next[`inputs/${s}`] = `Name ${s}`;
    if (form.citation.trim().length < 5) next['references/0/citation'] = 'Cite the source: author (year) title, journal volume:pages';
    setErrors(next);
    if (!Object.keys(next).length) create.mutate();
  }

  return (
    <div className="grid gap-6 xl:grid-cols-[1fr_480px]">
      <section className="panel">
        <h2 className="mb-2 font-semibold">Drafts, versions in review and returned versions</h2>
        <QueryState query={work}>
          {(d) => d.items.length === 0 ? <p className="text-sm text-ink-faint">Nothing open. Start a correlation, or open one in the library and start a new version.</p> : (
            <table className="table-plain">
              <thead><tr><th scope="col">Correlation</th><th scope="col">Version</th><th scope="col">Status</th><th scope="col">Changed (UTC)</th></tr></thead>
              <tbody>{d.items.map((w) => (
                <tr key={`${w.slug}-${w.version}`} className={w.status === 'returned' ? 'bg-caution-bg/40' : ''}>
                  <td>
                    <Link className="text-brand-dark hover:underline" href={w.status === 'draft' ? `/author/${w.slug}/${w.version}` : `/correlations/${w.slug}/versions/${w.version}`}>{w.title}</Link>
                    <div className="font-mono text-xs text-ink-soft">{w.slug}</div>
                    {w.status === 'returned' && (
                      <div className="mt-1 space-y-1 text-sm">
                        <p><span className="font-medium">Returned by {w.returnedBy}:</span> “{w.returnComment}”</p>
                        <p className="text-xs text-ink-soft">A returned version stays as it was, for the record. {w.nextDraft ? <>You are addressing it in <Link className="underline" href={`/author/${w.slug}/${w.nextDraft}`}>draft v{w.nextDraft}</Link>.</> : <>Open it and choose <em>Start a new version from v{w.version}</em> to make the changes and submit again.</>}</p>
                      </div>
                    )}
                    {w.status === 'in_review' && <p className="text-xs text-ink-soft">Waiting for an approver; frozen until they decide.</p>}
                  </td>
                  <td className="font-mono">v{w.version}</td><td><StatusBadge status={w.status} /></td><td className="text-xs">{w.updatedAt.slice(0, 16).replace('T', ' ')}</td>
                </tr>
              ))}</tbody>
            </table>
          )}
        </QueryState>
      </section>
      <form className="panel space-y-3" noValidate onSubmit={submit} aria-label="New correlation">
        <h2 className="font-semibold">New correlation</h2>
        <p className="text-xs text-ink-soft">Start from the formula and its source; ranges, constants, steps and check cases follow in the draft.</p>
        {errors.form && <p role="alert" className="text-sm text-danger">{errors.form}</p>}
        <Field label="Slug (stable public identifier)" error={errors.slug} hint="lower-case words joined by hyphens, e.g. duct-rectangular-laminar">{(p) => <input {...p} className="field-input font-mono" value={form.slug} onChange={(e) => setForm({ ...form, slug: e.target.value })} />}</Field>
        <Field label="Title" error={errors.title}>{(p) => <input {...p} className="field-input" placeholder="e.g. Laminar flow in rectangular ducts" value={form.title} onChange={(e) => setForm({ ...form, title: e.target.value })} />}</Field>
        <Field label="Summary" error={errors.summary}>{(p) => <textarea {...p} rows={2} className="field-input" placeholder="What it gives, for which situation" value={form.summary} onChange={(e) => setForm({ ...form, summary: e.target.value })} />}</Field>
        <Field label="Category">{(p) => <select {...p} className="field-input" value={form.category} onChange={(e) => setForm({ ...form, category: e.target.value })}>{CATEGORIES.map((c) => <option key={c} value={c}>{CATEGORY_LABELS[c]}</option>)}</select>}</Field>
        <Field label="Situation" error={errors.situation} hint="Correlations with the same situation can be compared">{(p) => <input {...p} className="field-input" placeholder="e.g. rectangular duct" value={form.situation} onChange={(e) => setForm({ ...form, situation: e.target.value })} />}</Field>
        <fieldset className="space-y-2 rounded border border-line p-2">
          <legend className="px-1 text-sm font-medium">The result and its formula</legend>
          <div className="grid grid-cols-[7rem_1fr_5rem] gap-2">
            <Field label="Symbol" error={errors['outputs/0/symbol']}>{(p) => <input {...p} className="field-input font-mono" placeholder="Nu_D" value={form.output.symbol} onChange={(e) => setForm({ ...form, output: { ...form.output, symbol: e.target.value } })} />}</Field>
            <Field label="Name" error={errors['outputs/0/name']}>{(p) => <input {...p} className="field-input" placeholder="average Nusselt number" value={form.output.name} onChange={(e) => setForm({ ...form, output: { ...form.output, name: e.target.value } })} />}</Field>
            <Field label="Unit" error={errors['outputs/0/unit']}>{(p) => <input {...p} className="field-input font-mono" value={form.output.unit} onChange={(e) => setForm({ ...form, output: { ...form.output, unit: e.target.value } })} />}</Field>
          </div>
          <Field label="Formula" error={errors['outputs/0/expression'] ?? (read.error && form.output.expression.trim() ? read.error : undefined)} hint="e.g. 0.3 + 0.62 * Re_D^(1/2) * Pr^(1/3); write * for every product">{(p) => <input {...p} className="field-input font-mono" value={form.output.expression} onChange={(e) => setForm({ ...form, output: { ...form.output, expression: e.target.value } })} />}</Field>
          {read.symbols.length > 0 && !read.error && form.output.symbol.trim() && (
            <div className="overflow-x-auto rounded bg-paper-sunk px-2" data-testid="formula-preview"><Tex tex={`${symbolTex(form.output.symbol.trim())} = ${toTex(checkExpression(form.output.expression, new Set(read.symbols)).node)}`} display /></div>
          )}
          {read.symbols.length > 0 && (
            <div className="space-y-1">
              <p className="text-sm font-medium">Its inputs</p>
              {read.symbols.map((s) => (
                <div key={s} className="grid grid-cols-[5rem_1fr_5rem] items-start gap-2">
                  <span className="pt-1.5 text-sm"><Sym s={s} /></span>
                  <Field label={`Name of ${s}`} error={errors[`inputs/${s}`]}>{(p) => <input {...p} className="field-input" placeholder="what it is, e.g. Reynolds number on the diameter" value={form.inputs[s]?.name ?? ''} onChange={(e) => setInput(s, { name: e.target.value })} />}</Field>
                  <Field label={`Unit of ${s}`}>{(p) => <input {...p} className="field-input font-mono" value={form.inputs[s]?.unit ?? '1'} onChange={(e) => setInput(s, { unit: e.target.value })} />}</Field>
                </div>
              ))}
            </div>
          )}
        </fieldset>
        <Field label="Source (citation)" error={errors['references/0/citation']}>{(p) => <input {...p} className="field-input" placeholder="Author (year) title, journal volume:pages" value={form.citation} onChange={(e) => setForm({ ...form, citation: e.target.value })} />}</Field>
        <Field label="Where in the source" hint="equation, table or page">{(p) => <input {...p} className="field-input" placeholder="eq. 12" value={form.locator} onChange={(e) => setForm({ ...form, locator: e.target.value })} />}</Field>
        <button className="btn-primary" disabled={create.isPending}>Create the draft</button>
      </form>
    </div>
  );
}
