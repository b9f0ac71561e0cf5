'use client';

import Link from 'next/link';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { usePathname, useRouter, useSearchParams } from 'next/navigation';
import { api } from '@/lib/client/api';
import { StatusBadge } from '@/components/ui/status-badge';
import { CATEGORIES, CATEGORY_LABELS } from '@/lib/engine/types';
import type { ApiAnswer } from '@/lib/client/typed';

type Library = ApiAnswer<'/api/correlations', 'get'>;
type SortKey = 'title' | 'category' | 'updated' | 'slug';

const PAGE_SIZE = 25;

export function LibraryTable() {
  // Search, filters, sort and page live in the address, so Back and a shared link keep them.
  const search = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const [q, setQ] = useState(search.get('q') ?? '');
  const [debounced, setDebounced] = useState(search.get('q') ?? '');
  const [category, setCategory] = useState(search.get('category') ?? '');
  const [status, setStatus] = useState(search.get('status') ?? '');
  const [grade, setGrade] = useState(search.get('grade') ?? '');
  const [sort, setSort] = useState<SortKey>((['title', 'category', 'updated', 'slug'] as const).find((k) => k === search.get('sort')) ?? 'title');
  const [dir, setDir] = useState<'asc' | 'desc'>(search.get('dir') === 'desc' ? 'desc' : 'asc');
  const [page, setPage] = useState(Math.max(1, Number(search.get('page')) || 1));
  useEffect(() => { const t = setTimeout(() => { if (q.trim() !== debounced) { setDebounced(q.trim()); setPage(1); } }, 250); return () => clearTimeout(t); }, [q, debounced]);
  useEffect(() => {
    const shown = new URLSearchParams();
    if (debounced) shown.set('q', debounced);
    if (category) shown.set('category', category);
    if (status) shown.set('status', status);
    if (grade) shown.set('grade', grade);
    if (sort !== 'title') shown.set('sort', sort);
    if (dir !== 'asc') shown.set('dir', dir);
    if (page > 1) shown.set('page', String(page));
    const next = shown.toString();
    if (next !== search.toString()) router.replace(next ? `${pathname}?${next}` : pathname, { scroll: false });
  }, [debounced, category, status, grade, sort, dir, page, pathname, router, search]);

  const params = new URLSearchParams({ page: String(page), pageSize: String(PAGE_SIZE), sort, dir });
  if (debounced) params.set('q', debounced);
  if (category) params.set('category', category);
  if (grade) params.set('grade', grade);
  if (status) params.set('status', status);
  const list = useQuery({ queryKey: ['library', params.toString()], queryFn: () => api<Library>(`/api/correlations?${params}`), placeholderData: keepPreviousData });

  const header = (key: SortKey, label: string) => (
    <th aria-sort={sort === key ? (dir === 'asc' ? 'ascending' : 'descending') : 'none'}>
      <button type="button" className="uppercase tracking-wide hover:text-ink" onClick={() => { if (sort === key) setDir(dir === 'asc' ? 'desc' : 'asc'); else { setSort(key); setDir('asc'); } setPage(1); }}>
        {label}{sort === key ? (dir === 'asc' ? ' ▲' : ' ▼') : ''}
      </button>
    </th>
  );
  const pages = list.data ? Math.max(1, Math.ceil(list.data.total / PAGE_SIZE)) : 1;

  return (
    <section className="panel space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex-1 text-sm">
          <span className="mb-1 block font-medium">Search</span>
          <input type="search" className="field-input" placeholder="title, slug, situation or tag — e.g. cylinder, colebrook" value={q} onChange={(e) => setQ(e.target.value)} />
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-medium">Category</span>
          <select className="field-input" value={category} onChange={(e) => { setCategory(e.target.value); setPage(1); }}>
            <option value="">all</option>
            {CATEGORIES.map((c) => <option key={c} value={c}>{CATEGORY_LABELS[c]}</option>)}
          </select>
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-medium">Has a version that is</span>
          <select className="field-input" value={status} onChange={(e) => { setStatus(e.target.value); setPage(1); }}>
            <option value="">any status</option>
            {['approved', 'in_review', 'draft', 'returned', 'withdrawn', 'superseded'].map((s) => <option key={s} value={s}>{s.replace('_', ' ')}</option>)}
          </select>
        </label>
        <label className="flex items-center gap-1 text-sm">Evidence
          <select className="field-input w-auto" value={grade} onChange={(e) => { setGrade(e.target.value); setPage(1); }}>
            <option value="">any grade</option>
            {['well-founded', 'adequate', 'thin'].map((g) => <option key={g} value={g}>{g}</option>)}
          </select>
        </label>
      </div>
      {list.isError && <p role="alert" className="text-sm text-danger">Could not load the library: {list.error.message}</p>}
      <div className="overflow-x-auto">
        <table className="table-plain">
          <thead>
            <tr>{header('title', 'Correlation')}<th>Situation</th>{header('category', 'Category')}<th>Approved</th><th>Evidence</th><th>Validity</th>{header('updated', 'Updated')}</tr>
          </thead>
          <tbody aria-busy={list.isFetching}>
            {list.isPending && <tr><td colSpan={7} className="animate-pulse text-ink-faint">Loading…</td></tr>}
            {list.data?.items.length === 0 && <tr><td colSpan={7} className="text-ink-faint">Nothing matches.</td></tr>}
            {list.data?.items.map((c) => (
              <tr key={c.slug} className="hover:bg-paper-sunk/60">
                <td>
                  <Link href={`/correlations/${c.slug}`} className="font-medium text-brand-dark hover:underline">{c.title}</Link>
                  <div className="font-mono text-xs text-ink-faint">{c.slug}</div>
                </td>
                <td>{c.situation}</td>
                <td>{CATEGORY_LABELS[c.category as keyof typeof CATEGORY_LABELS] ?? c.category}</td>
                <td>{c.latestApprovedVersion ? <span className="font-mono">v{c.latestApprovedVersion}</span> : <span className="text-ink-faint">none</span>}
                  {c.latestStatus !== 'approved' && <div className="mt-0.5"><StatusBadge status={c.latestStatus} /> <span className="text-xs text-ink-faint">v{c.latestVersion}</span></div>}</td>
                <td className="text-xs" title="evidence grade of the approved version">{c.evidenceGrade ?? '—'}</td>
                <td className="max-w-xs font-mono text-xs text-ink-soft">{c.validity || '—'}</td>
                <td className="whitespace-nowrap text-xs text-ink-soft">{new Date(c.updatedAt).toISOString().slice(0, 10)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <nav aria-label="Pages" className="flex items-center justify-between text-sm">
        <span className="text-ink-soft">{list.data ? `${list.data.total} correlation${list.data.total === 1 ? '' : 's'}` : ''}</span>
        <span className="flex items-center gap-2">
          <button type="button" className="btn-quiet" disabled={page <= 1} onClick={() => setPage(page - 1)}>Previous</button>
          <span>Page {page} of {pages}</span>
          <button type="button" className="btn-quiet" disabled={page >= pages} onClick={() => setPage(page + 1)}>Next</button>
        </span>
      </nav>
    </section>
  );
}
