'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { StatusBadge } from '@/components/ui/status-badge';
import { Field } from '@/components/ui/field';
import { SeriesChart, splitByValidity } from '@/components/charts/series-chart';
import { ValidationReportView } from '@/components/correlation/validation-report';
import { DefinitionFacts, EquationsSection } from '@/components/correlation/definition-summary';
import type { VersionDetail } from '@/components/correlation/types';
import type { Comparison, Difference } from '@/lib/engine/compare';
import { formatNumber } from '@/lib/client/units';
import { DomainDiff } from './domain-diff';
import { CompanySignature, useCompanySignature, useDraftAcrossSignIn } from './company-signature';
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
  // A resubmission: the version just before this one went back to its author; show what was changed in answer.
  const before = useQuery({
    queryKey: ['version', slug, version - 1], enabled: version > 1 && detail.data !== undefined && !isTemplate,
    queryFn: () => api<VersionDetail>(`/api/correlations/${slug}/versions/${version - 1}`),
  });
  const returned = before.data?.status === 'returned' && before.data.version !== deviation.data?.previous ? before.data : null;
  const returnNote = returned ? [...returned.signOffs].reverse().find((s) => s.decision === 'returned') : undefined;

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
          {returned && (
            <section className="panel space-y-2" aria-label="Answer to the return">
              <h2 className="font-semibold">What the author changed since version {returned.version} was returned</h2>
              {returnNote && <p className="text-sm"><span className="text-ink-soft">{returnNote.by} returned it:</span> “{returnNote.comment}”</p>}
              <DomainDiff before={returned} after={v} />
            </section>
          )}
          <section className="panel space-y-2" aria-label="Differences">
            <h2 className="font-semibold">What changed since the previous approved version</h2>
            {deviation.data && !deviation.data.previous && <p className="text-sm text-ink-soft">{deviation.data.message} Judge it from the definition above and the check cases below.</p>}
            {previous.data && <DomainDiff before={previous.data} after={v} />}
          </section>

          {deviation.data?.previous && (
            <section className="panel space-y-2" aria-label="Deviation">
              <h2 className="font-semibold">Numerical difference across the range</h2>
              <QueryState query={deviation}>
                {(dv) => !dv.comparison ? <p className="text-sm text-ink-soft">{dv.message}</p> : (
                  <>
                    <p className="rounded bg-brand-light px-3 py-2 text-sm" data-testid="largest-difference">
                      {differenceInWords(dv.comparison.differences[0], dv.comparison, dv.previous!, version)}
                      {' '}Other inputs at {Object.entries(dv.fixed ?? {}).map(([sym, x]) => `${sym} = ${formatNumber(x, 3)}`).join(', ') || '—'}; only where both versions are inside their validity ranges.
                    </p>
                    <SeriesChart logX={dv.comparison.scale === 'log'} scaleSwitches xDomain={[dv.comparison.from, dv.comparison.to]} xLabel={dv.comparison.sweep} yLabel={dv.comparison.output}
                      caption={`${dv.comparison.output} of versions ${dv.previous} and ${version} against ${dv.comparison.sweep}; dashed outside each version's validity range`}
                      series={dv.comparison.series.flatMap((s, k) => splitByValidity(s.label, s.points, k))}
                      limits={dv.comparison.differences[0]?.kind === 'varies' ? [{ x: dv.comparison.largest[0].at, label: 'largest difference' }] : []} />
                    {dv.comparison.differences[0]?.kind === 'varies' && (
                      <SeriesChart height={200} logX={dv.comparison.scale === 'log'} xDomain={[dv.comparison.from, dv.comparison.to]} xLabel={dv.comparison.sweep} yLabel="Δ, %"
                        caption={`Relative difference of version ${version} from version ${dv.previous}, in per cent, where both are valid`}
                        series={[{ label: `(v${version} − v${dv.previous}) / v${dv.previous}, %`, points: relativeDifference(dv.comparison) }]} />
                    )}
                  </>
                )}
              </QueryState>
            </section>
          )}
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

/** The difference in a sentence: none, uniform ("uniformly +0.089 %"), or from … to …, with where it is largest. */
function differenceInWords(d: Difference | undefined, c: Comparison, previous: number, version: number): string {
  const pct = (x: number) => `${x >= 0 ? '+' : '−'}${formatNumber(Math.abs(x) * 100, 3)} %`;
  if (!d || d.kind === 'no-overlap') return `Versions ${previous} and ${version} are nowhere both inside their validity ranges on this sweep.`;
  if (d.kind === 'none') return `Version ${version} gives the same ${c.output} as version ${previous} across the range (to the evaluation's rounding).`;
  if (d.kind === 'uniform') return `Version ${version} differs from version ${previous} uniformly by ${pct(d.value!)} in ${c.output} across the range.`;
  return `Version ${version} differs from version ${previous} by ${pct(d.min!)} to ${pct(d.max!)} in ${c.output}; the largest difference, ${formatNumber(c.largest[0].relDiff * 100, 3)} %, is at ${c.sweep} = ${formatNumber(c.largest[0].at, 4)}.`;
}

/** Per cent difference of the second series from the first where both are valid; below the rounding, zero. */
function relativeDifference(c: Comparison): { x: number; y: number | null }[] {
  const [base, next] = c.series;
  return next.points.map((p, k) => {
    const b = base.points[k];
    if (p.y === null || b.y === null || !b.y || p.warned || b.warned) return { x: p.x, y: null };
    const r = (p.y - b.y) / Math.abs(b.y);
    return { x: p.x, y: Math.abs(r) < 1e-9 ? 0 : r * 100 };
  });
}

function DecisionForm({ slug, version, needsWaiver }: { slug: string; version: number; needsWaiver: boolean }) {
  const router = useRouter();
  const [comment, setComment] = useState('');
  const [waiver, setWaiver] = useState('');
  const qc = useQueryClient();
  const [password, setPassword] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const signature = useCompanySignature();
  const keepDraft = useDraftAcrossSignIn(`sign-off:${slug}:${version}`, { comment, waiver }, (d) => { setComment(d.comment); setWaiver(d.waiver); });
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
      {signature.company
        ? <CompanySignature fresh={signature.fresh} authAt={signature.authAt} error={errors.password} beforeLeaving={keepDraft} what="this decision" />
        : <Field label="Your password, to sign" error={errors.password}>{(p) => <input {...p} type="password" autoComplete="current-password" className="field-input max-w-xs" value={password} onChange={(e) => setPassword(e.target.value)} />}</Field>}
      <div className="flex gap-2">
        <button type="button" className="btn-primary" disabled={decide.isPending} onClick={() => {
          if (signature.company ? !signature.fresh : !password) { setErrors({ password: signature.company ? 'Confirm with your company account to sign' : 'Enter your password to sign' }); return; }
          decide.mutate('approve');
        }}>Approve and sign</button>
        <button type="button" className="btn-quiet" disabled={decide.isPending} onClick={() => { if (!comment.trim()) { setErrors({ comment: 'Say what the author should change' }); return; } decide.mutate('return'); }}>Return to the author</button>
      </div>
    </form>
  );
}
