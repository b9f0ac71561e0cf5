'use client';

import Link from 'next/link';
import { useMutation, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { api, ApiError } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';
import { StatusBadge } from '@/components/ui/status-badge';
import { Caution } from '@/components/ui/caution';
import { TabList } from '@/components/ui/tab-list';
import type { TemplateDefinition } from '@/lib/engine/template-types';
import { InputForm, initialInputs, readForm, type InputState } from './input-form';
import { chainNotices, ResultsTable, StepChain } from './step-chain';
import { UncertaintyBudget } from './uncertainty-budget';
import { SavePanel } from './save-panel';
import { ParametricRun } from './parametric';
import { ChainOutline } from './chain-outline';
import type { RunAnswer } from './types';

interface Detail { slug: string; version: number; status: string; contentHash: string | null; author: string; definition: TemplateDefinition; checkCases: { inputs: Record<string, unknown> }[] }
interface Summary { latestApprovedVersion: number | null; versions: { version: number; status: string }[] }

/** A calculation template: what it chains, a single case with every step shown, or a table of cases. */
export function TemplateWorkspace({ slug, version: pinned }: { slug: string; version?: number }) {
  const summary = useQuery({ queryKey: ['correlation', slug], queryFn: () => api<Summary>(`/api/correlations/${slug}`) });
  const version = pinned ?? summary.data?.latestApprovedVersion ?? summary.data?.versions[0]?.version;
  const detail = useQuery({ queryKey: ['version', slug, version], enabled: version !== undefined, queryFn: () => api<Detail>(`/api/correlations/${slug}/versions/${version}`) });
  return (
    <QueryState query={summary}>
      {() => (version === undefined ? <p>No version of this template you can see.</p> : (
        <QueryState query={detail}>
          {(d) => <Workspace detail={d} />}
        </QueryState>
      ))}
    </QueryState>
  );
}

function Workspace({ detail }: { detail: Detail }) {
  const def = detail.definition;
  const example = detail.checkCases[0]?.inputs;
  const [tab, setTab] = useState<'single' | 'table' | 'chain'>('single');
  const [state, setState] = useState<InputState>(() => initialInputs(def.inputs, example));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [lastInputs, setLastInputs] = useState<Record<string, unknown> | null>(null);
  const run = useMutation({
    mutationFn: (inputs: Record<string, unknown>) => api<RunAnswer>(`/api/templates/${detail.slug}/run`, { body: { version: detail.version, inputs } }),
    onError: (e) => setErrors(e instanceof ApiError ? e.fieldErrors() : {}),
  });
  function submit(e: React.FormEvent) {
    e.preventDefault();
    const { inputs, errors: errs } = readForm(def.inputs, state);
    setErrors(errs);
    // Never leave an earlier result on screen next to inputs it does not belong to.
    run.reset();
    setLastInputs(null);
    if (!Object.keys(errs).length) { setLastInputs(inputs); run.mutate(inputs); }
  }
  const names = Object.fromEntries(def.outputs.map((o) => [o.symbol, o.name]));
  const notices = chainNotices(run.data?.warnings, run.data?.steps);
  const warnCount = run.data?.warnings?.length ?? 0;

  return (
    <div className="space-y-4">
      <header className="space-y-2">
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-xl font-semibold">{def.title}</h1>
          <StatusBadge status={detail.status} />
          <span className="font-mono text-sm text-ink-soft">template v{detail.version}</span>
        </div>
        <p className="max-w-4xl text-sm text-ink-soft">{def.summary}</p>
        <p className="text-xs text-ink-soft">slug <code className="text-ink">{detail.slug}</code> · content hash <code title={detail.contentHash ?? ''}>{detail.contentHash?.slice(0, 16) ?? 'not frozen'}</code> · by {detail.author} · <Link className="underline" href={`/correlations/${detail.slug}/versions/${detail.version}`}>version record, check cases and sign-off</Link></p>
        {detail.status !== 'approved' && <p className="rounded border border-caution-line bg-caution-bg px-3 py-2 text-sm text-caution">This template version is <strong>{detail.status.replace('_', ' ')}</strong>: not approved for design use; calculations cannot be saved from it.</p>}
      </header>
      <TabList label="Ways to use the template" tabs={[['single', 'One case'], ['table', 'Table of cases'], ['chain', 'What it chains']]} value={tab} onChange={setTab}
        className="flex gap-1 border-b border-line" tabClass={(on) => `-mb-px rounded-t border px-3 py-1.5 text-sm ${on ? 'border-line border-b-paper bg-paper font-medium text-ink' : 'border-transparent text-ink-soft hover:text-ink'}`} />
      {tab === 'chain' && <ChainOutline definition={def} />}
      {tab === 'table' && <ParametricRun slug={detail.slug} version={detail.version} definition={def} example={example} />}
      {tab === 'single' && (
        <div className="grid gap-4 lg:grid-cols-[22rem_1fr]">
          <aside className="space-y-3">
            <form onSubmit={submit} noValidate className="panel space-y-3" aria-label="Inputs">
              <h2 className="font-semibold">Inputs</h2>
              <InputForm inputs={def.inputs} state={state} onChange={setState} errors={errors} />
              <button type="submit" className="btn-primary w-full justify-center" disabled={run.isPending}>{run.isPending ? 'Running…' : 'Run the calculation'}</button>
              {run.isError && !Object.keys(errors).length && <p role="alert" className="rounded bg-danger-bg px-2 py-1 text-sm text-danger">{run.error.message}</p>}
            </form>
            {run.data && lastInputs && detail.status === 'approved' && (
              <SavePanel defaultTitle={def.title} body={() => ({ template: { slug: detail.slug, version: detail.version }, inputs: lastInputs })} />
            )}
            <Caution />
          </aside>
          <div className="space-y-4" aria-live="polite">
            {!run.data && !run.isPending && <p className="text-sm text-ink-soft">Enter the inputs and run: every step is shown with what it took and gave, and any range warning appears at the step where it arises.</p>}
            {run.data && (
              <>
                <section className="space-y-2">
                  <div className="flex flex-wrap items-center gap-3">
                    <h2 className="font-semibold">Results</h2>
                    {warnCount > 0
                      ? <span role="status" className="rounded bg-caution-bg px-2 py-0.5 text-sm font-medium text-caution">⚠ {warnCount} range warning{warnCount === 1 ? '' : 's'}: see the marked steps</span>
                      : <span className="rounded bg-ok-bg px-2 py-0.5 text-sm text-ok">every step inside its validity range</span>}
                  </div>
                  <ResultsTable outputs={run.data.outputs ?? {}} units={run.data.units} names={names} warned={warnCount > 0} bands={run.data.uncertainty?.outputs} />
                </section>
                <UncertaintyBudget uncertainty={run.data.uncertainty} names={names} />
                <section className="space-y-2">
                  <h2 className="font-semibold">Steps</h2>
                  <StepChain steps={run.data.steps ?? []} notices={notices} />
                </section>
              </>
            )}
          </div>
        </div>
      )}
    </div>
  );
}
