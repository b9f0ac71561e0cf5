'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { StatusBadge } from '@/components/ui/status-badge';
import { Field } from '@/components/ui/field';
import { SeriesChart } from '@/components/charts/series-chart';
import { ValidationReportView } from '@/components/correlation/validation-report';
import { DefinitionFacts, EquationsSection } from '@/components/correlation/definition-summary';
import type { VersionDetail } from '@/components/correlation/types';
import type { Comparison } from '@/lib/engine/compare';
import { formatNumber } from '@/lib/client/units';
import { DefinitionDiff } from './definition-diff';
import { ChainOutline } from '@/components/calculation/chain-outline';
import type { TemplateDefinition } from '@/lib/engine/template-types';

const MEANING = 'I reviewed the definition, references and validation report; approved for use.';

interface Deviation { previous: number | null; fixed?: Record<string, number>; comparison: Comparison | null; message: string | null }

export function ReviewView({ slug, version, userId }: { slug: string; version: number; userId: number }) {
  const detail = useQuery({ queryKey: ['version', slug, version], queryFn: () => api<VersionDetail>(`/api/correlations/${slug}/versions/${version}`) });
  const isTemplate = detail.data?.kind === 'template';
  const deviation = useQuery({ queryKey: ['deviation', slug, version], enabled: detail.data !== undefined && !isTemplate, queryFn: () => api<Deviation>(`/api/correlations/${slug}/versions/${version}/deviation`) });
  const previous = useQuery({
    queryKey: ['version', slug, deviation.data?.previous], enabled: Boolean(deviation.data?.previous),
    queryFn: () => api<VersionDetail>(`/api/correlations/${slug}/versions/${deviation.data!.previous}`),
  });

  return (
    <QueryState query={detail}>
      {(v) => (
        <div className="space-y-5">
          <header className="flex flex-wrap items-center gap-3">
            <h1 className="text-xl font-semibold">Review: {v.definition.title}</h1>
            <StatusBadge status={v.status} /><span className="font-mono text-sm text-ink-soft">{slug} v{version} by {v.author}</span>
            <Link href={`/correlations/${slug}/versions/${version}`} className="ml-auto text-sm text-brand-dark underline">Open the full version page</Link>
          </header>

          {v.kind === 'template' && (
            <section className="space-y-2" aria-label="The chain under review">
              <h2 className="font-semibold">The chain under review</h2>
              <p className="text-sm text-ink-soft">Every pinned correlation version, binding and rule below is what you sign; the validation report shows the template's own check cases run through the whole chain.</p>
              <ChainOutline definition={v.definition as unknown as TemplateDefinition} />
            </section>
          )}
          {v.kind !== 'template' && <>
          <section className="space-y-3" aria-label="The definition under review">
            <h2 className="font-semibold">The definition under review</h2>
            <EquationsSection v={v} />
            <DefinitionFacts v={v} />
          </section>
          <section className="panel space-y-2" aria-label="Differences">
            <h2 className="font-semibold">Definition against the previous approved version</h2>
            {deviation.data && !deviation.data.previous && <p className="text-sm text-ink-soft">{deviation.data.message}</p>}
            {previous.data && <DefinitionDiff before={previous.data.definition} after={v.definition} leftLabel={`version ${previous.data.version} (${previous.data.status})`} rightLabel={`version ${version} (this review)`} />}
          </section>

          <section className="panel space-y-2" aria-label="Deviation">
            <h2 className="font-semibold">Numerical difference across the range</h2>
            <QueryState query={deviation}>
              {(dv) => !dv.comparison ? <p className="text-sm text-ink-soft">{dv.message}</p> : (
                <>
                  <p className="rounded bg-brand-light px-3 py-2 text-sm" data-testid="largest-difference">
                    Largest difference: <strong>{(dv.comparison.largest[0].relDiff * 100).toPrecision(3)} %</strong> of {dv.comparison.output} at {dv.comparison.sweep} = {formatNumber(dv.comparison.largest[0].at, 4)}
                    {' '}(other inputs at {Object.entries(dv.fixed ?? {}).map(([s, x]) => `${s} = ${formatNumber(x, 3)}`).join(', ') || '—'}).
                  </p>
                  <SeriesChart logX={dv.comparison.scale === 'log'} xLabel={dv.comparison.sweep} yLabel={dv.comparison.output}
                    series={dv.comparison.series.map((s) => ({ label: s.label, points: s.points }))}
                    limits={[{ x: dv.comparison.largest[0].at, label: 'largest difference' }]} />
                  <SeriesChart height={200} logX={dv.comparison.scale === 'log'} xLabel={dv.comparison.sweep} yLabel="Δ, %"
                    series={[{ label: `(v${version} − v${dv.previous}) / v${dv.previous}, %`, points: dv.comparison.series[1].points.map((p, k) => { const b = dv.comparison!.series[0].points[k].y; return { x: p.x, y: p.y !== null && b ? ((p.y - b) / Math.abs(b)) * 100 : null }; }) }]} />
                </>
              )}
            </QueryState>
          </section>
          </>}

          <ValidationReportView report={v.validation} checkCases={v.checkCases} />
          {v.comments.length > 0 && <section className="panel"><h2 className="font-semibold">Comments</h2><ul className="text-sm">{v.comments.map((c, k) => <li key={k}>{c.by}: {c.body}</li>)}</ul></section>}
          {v.status !== 'in_review' ? <p className="panel text-sm">This version is {v.status.replace('_', ' ')}; there is nothing to decide.</p>
            : v.authorId === userId ? <p className="panel text-sm text-caution">You authored this version; another approver must review it (four-eyes rule).</p>
            : <DecisionForm slug={slug} version={version} needsWaiver={v.kind !== 'template' && Boolean(v.validation && !v.validation.evidence?.meetsPolicy)} />}
        </div>
      )}
    </QueryState>
  );
}

function DecisionForm({ slug, version, needsWaiver }: { slug: string; version: number; needsWaiver: boolean }) {
  const router = useRouter();
  const [comment, setComment] = useState('');
  const [waiver, setWaiver] = useState('');
  const qc = useQueryClient();
  const [password, setPassword] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const decide = useMutation({
    mutationFn: (decision: 'approve' | 'return') => api(`/api/correlations/${slug}/versions/${version}/decision`, { body: { decision, comment, ...(decision === 'approve' ? { password, ...(needsWaiver ? { waiver } : {}) } : {}) } }),
    // The cached version still says "in review": drop it so the page shows the state just signed.
    onSuccess: async (_, decision) => {
      await Promise.all([qc.invalidateQueries({ queryKey: ['version', slug] }), qc.invalidateQueries({ queryKey: ['correlation', slug] }), qc.invalidateQueries({ queryKey: ['deviation', slug] })]);
      router.push(`/correlations/${slug}/versions/${version}?signed=${decision === 'approve' ? 'approved' : 'returned'}`);
    },
    onError: (e) => setErrors(e instanceof ApiError ? { ...e.fieldErrors(), form: e.message } : { form: String(e) }),
  });
  return (
    <form className="panel space-y-3" noValidate aria-label="Sign-off" onSubmit={(e) => e.preventDefault()}>
      <h2 className="font-semibold">Sign-off</h2>
      {errors.form && <p role="alert" className="text-sm text-danger">{errors.form}</p>}
      <Field label="Comment (required when returning)" error={errors.comment}>{(p) => <textarea {...p} rows={3} className="field-input" value={comment} onChange={(e) => setComment(e.target.value)} />}</Field>
      <p className="rounded border border-line bg-paper-sunk px-3 py-2 text-sm">Meaning of your signature: <em>{MEANING}</em></p>
      {needsWaiver && (
        <Field label="Waiver: why you approve below the evidence policy (recorded with your signature)" error={errors.waiver} hint="The validation report shows the evidence is below the approval policy; say why this version may be used anyway.">
          {(p) => <textarea {...p} rows={2} className="field-input" value={waiver} onChange={(e) => setWaiver(e.target.value)} />}
        </Field>
      )}
      <Field label="Your password, to sign" error={errors.password}>{(p) => <input {...p} type="password" autoComplete="current-password" className="field-input max-w-xs" value={password} onChange={(e) => setPassword(e.target.value)} />}</Field>
      <div className="flex gap-2">
        <button type="button" className="btn-primary" disabled={decide.isPending} onClick={() => { if (!password) { setErrors({ password: 'Enter your password to sign' }); return; } decide.mutate('approve'); }}>Approve and sign</button>
        <button type="button" className="btn-quiet" disabled={decide.isPending} onClick={() => { if (!comment.trim()) { setErrors({ comment: 'Say what the author should change' }); return; } decide.mutate('return'); }}>Return to the author</button>
      </div>
    </form>
  );
}
