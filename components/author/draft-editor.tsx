'use client';

import dynamic from 'next/dynamic';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import { useSearchParams } from 'next/navigation';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { StatusBadge } from '@/components/ui/status-badge';
import { ValidationReportView } from '@/components/correlation/validation-report';
import type { VersionDetail } from '@/components/correlation/types';
import type { CheckCase, Definition } from '@/lib/engine/types';
import type { ValidationReport } from '@/lib/engine/validate';
import definitionSchema from '@/validation/definition.schema.json';
import { CheckCaseTable } from './check-case-table';
import { DefinitionForm } from './definition-form';
import { TabList } from '@/components/ui/tab-list';

const JsonEditor = dynamic(() => import('@/components/editor/json-editor'), { ssr: false, loading: () => <p className="animate-pulse p-4 text-sm text-ink-faint">Loading editor…</p> });

type Tab = 'json' | 'form' | 'cases';

export function DraftEditor({ slug, version, userId }: { slug: string; version: number; userId: number }) {
  const detail = useQuery({ queryKey: ['version', slug, version], queryFn: () => api<VersionDetail>(`/api/correlations/${slug}/versions/${version}`) });
  return (
    <QueryState query={detail}>
      {(v) => v.status !== 'draft' || v.authorId !== userId ? (
        <div className="panel space-y-2">
          <p>Version {version} of <code>{slug}</code> is <StatusBadge status={v.status} />{v.authorId !== userId ? ' and belongs to another author' : ''}: it cannot be edited here.</p>
          <Link className="btn-quiet" href={`/correlations/${slug}/versions/${version}`}>Open the version</Link>
        </div>
      ) : <Editor detail={v} />}
    </QueryState>
  );
}

function Editor({ detail }: { detail: VersionDetail }) {
  const router = useRouter();
  const qc = useQueryClient();
  const { slug, version } = detail;
  const [tab, setTab] = useState<Tab>('form');
  const created = useSearchParams().get('created') === '1';
  const [pendingRows, setPendingRows] = useState(false);
  const onPending = useCallback((p: boolean) => setPendingRows(p), []);
  const [text, setText] = useState(() => JSON.stringify(detail.definition, null, 2));
  const [editorKey, setEditorKey] = useState(0);
  const [cases, setCases] = useState<CheckCase[]>(detail.checkCases);
  const [report, setReport] = useState<ValidationReport | null>(null);
  const [problems, setProblems] = useState<{ path: string; message: string }[]>([]);
  const [message, setMessage] = useState<{ kind: 'ok' | 'error'; text: string } | null>(null);
  const [dirty, setDirty] = useState(false);

  let parsed: Definition | null = null;
  let jsonError = '';
  try { parsed = JSON.parse(text) as Definition; } catch (e) { jsonError = (e as Error).message; }

  const save = async () => {
    if (!parsed) throw new Error(`The definition is not valid JSON: ${jsonError}`);
    if (pendingRows) throw new Error('Rows you pasted or uploaded are waiting in the preview on the “Check cases” tab: add them or discard them first; nothing was saved.');
    await api(`/api/correlations/${slug}/versions/${version}`, { method: 'PATCH', body: { definition: parsed, checkCases: cases } });
    setDirty(false);
  };
  const fail = (e: unknown) => {
    setMessage({ kind: 'error', text: e instanceof Error ? e.message : String(e) });
    if (e instanceof ApiError) {
      setProblems(e.details?.issues ?? []);
      if (e.details?.report) setReport(e.details.report as unknown as ValidationReport);
    }
  };
  const saveOnly = useMutation({ mutationFn: save, onSuccess: () => { setProblems([]); setMessage({ kind: 'ok', text: 'Draft saved.' }); }, onError: fail });
  const validate = useMutation({
    mutationFn: async () => { await save(); return api<ValidationReport>(`/api/correlations/${slug}/versions/${version}/validate`, { method: 'POST' }); },
    onSuccess: (r) => { setReport(r); setProblems([]); setMessage({ kind: r.passed ? 'ok' : 'error', text: r.passed ? 'Saved; validation passed. You can submit for review.' : 'Saved; validation found problems (see the report below).' }); },
    onError: fail,
  });
  const submit = useMutation({
    mutationFn: async () => { await save(); return api<{ status: string }>(`/api/correlations/${slug}/versions/${version}/submit`, { method: 'POST' }); },
    onSuccess: () => { qc.invalidateQueries({ queryKey: ['version', slug] }); router.push(`/correlations/${slug}/versions/${version}`); },
    onError: fail,
  });
  const busy = saveOnly.isPending || validate.isPending || submit.isPending;

  return (
    <div className="space-y-4">
      <header className="flex flex-wrap items-center gap-3">
        <h1 className="text-xl font-semibold">{parsed?.title ?? detail.title}</h1>
        <StatusBadge status="draft" /><span className="font-mono text-sm text-ink-soft">{slug} v{version}</span>
        {dirty && <span className="text-xs text-caution">unsaved changes</span>}
        <div className="ml-auto flex gap-2">
          <button type="button" className="btn-quiet" disabled={busy} onClick={() => saveOnly.mutate()}>Save draft</button>
          <button type="button" className="btn-quiet" disabled={busy} onClick={() => validate.mutate()}>Save and validate</button>
          <button type="button" className="btn-primary" disabled={busy} onClick={() => submit.mutate()}>Submit for review</button>
        </div>
      </header>
      {created && !message && <p role="status" className="rounded bg-ok-bg px-3 py-2 text-sm text-ok">Draft v{version} created. Add the validity ranges, any constants and steps, the stated accuracy and check cases; “Save and validate” runs every check.</p>}
      {message && <p role={message.kind === 'error' ? 'alert' : 'status'} className={`rounded px-3 py-2 text-sm ${message.kind === 'ok' ? 'bg-ok-bg text-ok' : 'bg-danger-bg text-danger'}`}>{message.text}</p>}
      {problems.length > 0 && (
        <ul className="rounded border border-danger/30 bg-danger-bg px-3 py-2 text-sm text-danger" aria-label="Problems">
          {problems.slice(0, 30).map((p, k) => <li key={k}><code className="text-xs">{p.path}</code> {p.message}</li>)}
        </ul>
      )}
      <TabList label="Draft parts" value={tab} className="flex gap-1 border-b border-line"
        tabs={[['form', 'Definition'], ['cases', `Check cases (${cases.length})${pendingRows ? ' · rows waiting' : ''}`], ['json', 'JSON']]}
        onChange={(t) => { if (t === 'json') setEditorKey((k) => k + 1); setTab(t); }}
        tabClass={(on) => `-mb-px border-b-2 px-3 py-2 text-sm ${on ? 'border-brand font-medium text-brand-dark' : 'border-transparent text-ink-soft hover:text-ink'}`} />
      {tab === 'json' && (
        <section aria-label="Definition JSON" className="space-y-1">
          <JsonEditor key={editorKey} path={`${slug}-v${version}-definition.json`} defaultValue={text} schema={definitionSchema} onChange={(t) => { setText(t); setDirty(true); }} />
          {jsonError ? <p className="text-xs text-danger">Not valid JSON yet: {jsonError}</p> : <p className="text-xs text-ink-faint">Completion and inline errors follow the definition JSON Schema (Ctrl+Space for suggestions).</p>}
        </section>
      )}
      {tab === 'form' && (parsed ? <DefinitionForm definition={parsed} onChange={(d) => { setText(JSON.stringify(d, null, 2)); setDirty(true); }} /> : <p className="text-sm text-danger">Fix the JSON first: {jsonError}</p>)}
      {tab === 'cases' && (parsed ? <CheckCaseTable definition={parsed} cases={cases} onChange={(c) => { setCases(c); setDirty(true); }} report={report} onPending={onPending} /> : <p className="text-sm text-danger">Fix the JSON first: {jsonError}</p>)}
      <ValidationReportView report={report} checkCases={cases} title="Live validation report" emptyText={`Press “Save and validate” to run schema, expression, dimension and check-case checks on this draft (${cases.length} check case${cases.length === 1 ? '' : 's'}).`} />
    </div>
  );
}
