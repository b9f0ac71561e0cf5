'use client';

import Link from 'next/link';
import { useQueries } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { formatNumber } from '@/lib/client/units';
import { QueryState } from '@/components/ui/query-state';
import { Caution } from '@/components/ui/caution';
import { pinsOf } from '@/lib/engine/template-types';
import { ResultsTable, StepChain } from './step-chain';
import { UncertaintyBudget } from './uncertainty-budget';
import { FlagBanner, inputText, useCalculation } from './calculation-view';
import { Sym } from '@/components/ui/sym';

interface PinnedDetail { slug: string; version: number; title: string; contentHash: string; status: string; definition: { references: { citation: string; locator?: string; doi?: string }[]; propertyBasis?: string } }

/** The printable record of a saved calculation: the browser prints it or saves it as PDF. */
export function CalculationReport({ id, revision }: { id: number; revision?: number }) {
  const q = useCalculation(id, revision);
  const pins = q.data ? pinsOf(q.data.content.chain) : [];
  const pinned = useQueries({ queries: pins.map((p) => ({ queryKey: ['version', p.slug, p.version], queryFn: () => api<PinnedDetail>(`/api/correlations/${p.slug}/versions/${p.version}`) })) });
  return (
    <QueryState query={q}>
      {(c) => {
        const { content } = c;
        const a = content.answer;
        const names = Object.fromEntries(content.chain.outputs.map((o) => [o.symbol, o.name]));
        return (
          <article className="report mx-auto max-w-4xl space-y-4 bg-paper-raised p-6 print:p-0">
            <div className="flex items-center gap-2 print:hidden">
              <button type="button" className="btn-primary" onClick={() => window.print()}>Print or save as PDF</button>
              <Link className="btn-quiet" href={`/calculations/${id}?revision=${c.revision}`}>Back to the calculation</Link>
            </div>
            <header className="border-b border-line pb-3">
              <p className="text-xs text-ink-soft">Correlary calculation record · project {c.project.name}</p>
              <h1 className="text-2xl font-semibold">{c.title}</h1>
              <dl className="mt-2 grid grid-cols-[10rem_1fr] gap-x-3 text-sm">
                <dt className="text-ink-soft">revision</dt><dd>{c.revision} (latest {c.latestRevision})</dd>
                <dt className="text-ink-soft">run and saved by</dt><dd>{c.savedBy}, {new Date(c.savedAt).toISOString().replace('T', ' ').slice(0, 19)} UTC</dd>
                <dt className="text-ink-soft">template</dt><dd>{content.template ? `${content.template.title} (${content.template.slug}) v${content.template.version}, content hash ${content.template.contentHash}` : 'own chain of approved steps'}</dd>
                <dt className="text-ink-soft">record content hash</dt><dd className="break-all font-mono text-xs">{c.contentHash}</dd>
                <dt className="text-ink-soft">engine</dt><dd>{content.engineVersion}</dd>
                {c.note && <><dt className="text-ink-soft">note</dt><dd>{c.note}</dd></>}
              </dl>
            </header>
            <Caution />
            <FlagBanner flags={c.flags} />
            {!content.request.rows && (
              <>
                <section><h2 className="font-semibold">Inputs</h2>
                  <table className="table-plain"><tbody>{content.chain.inputs.map((i) => <tr key={i.symbol}><th scope="row" className="w-24"><Sym s={i.symbol} /></th><td>{i.name}</td><td className="font-mono">{inputText(content.request.inputs?.[i.symbol], i.unit)}</td></tr>)}</tbody></table>
                </section>
                <section><h2 className="font-semibold">Results</h2><ResultsTable outputs={a.outputs ?? {}} units={a.units} names={names} warned={(a.warnings?.length ?? 0) > 0} bands={a.uncertainty?.outputs} /></section>
                <section className="space-y-1"><h2 className="font-semibold">Range warnings</h2>
                  {(a.warnings ?? []).length === 0 ? <p className="text-sm">None: every step inside its published validity range.</p> : <ul className="list-disc pl-5 text-sm">{a.warnings!.map((w, k) => <li key={k}>step {w.step}: {w.message}</li>)}</ul>}
                </section>
                <UncertaintyBudget uncertainty={a.uncertainty} names={names} />
                <section className="space-y-2"><h2 className="font-semibold">The chain, step by step</h2><StepChain steps={a.steps ?? []} /></section>
              </>
            )}
            {content.request.rows && a.results && (
              <section><h2 className="font-semibold">{content.request.rows.length} cases</h2>
                <table className="table-plain text-xs"><thead><tr><th scope="col">#</th>{content.chain.inputs.map((i) => <th scope="col" key={i.symbol}>{i.symbol}</th>)}{content.chain.outputs.map((o) => <th scope="col" key={o.symbol}>{o.symbol} [{a.units[o.symbol]}]</th>)}<th scope="col">warnings</th></tr></thead>
                  <tbody>{a.results.map((r, k) => <tr key={k}><td>{k + 1}</td>{content.chain.inputs.map((i) => <td key={i.symbol}>{inputText(content.request.rows![k][i.symbol], i.unit)}</td>)}{content.chain.outputs.map((o) => <td key={o.symbol}>{formatNumber(r.outputs?.[o.symbol], 5)}</td>)}<td>{r.error?.message ?? r.warnings.map((w) => `${w.step}: ${w.symbol}`).join('; ')}</td></tr>)}</tbody></table>
              </section>
            )}
            <section className="space-y-1 break-inside-avoid"><h2 className="font-semibold">Versions and references</h2>
              <table className="table-plain text-xs"><thead><tr><th scope="col">correlation</th><th scope="col">version</th><th scope="col">content hash</th><th scope="col">references</th></tr></thead>
                <tbody>{pins.map((p, k) => { const d = pinned[k]?.data; return (
                  <tr key={`${p.slug}${p.version}`}><td>{d?.title ?? p.slug}<br /><code>{p.slug}</code></td><td>{p.version}{d && d.status !== 'approved' ? ` (${d.status})` : ''}</td><td className="break-all font-mono">{p.contentHash}</td>
                    <td>{d?.definition.references.map((r) => <p key={r.citation}>{r.citation}{r.locator ? `, ${r.locator}` : ''}{r.doi ? `, doi:${r.doi}` : ''}</p>)}{d?.definition.propertyBasis && <p className="text-ink-soft">properties: {d.definition.propertyBasis}</p>}</td></tr>); })}
                </tbody></table>
              <ul className="text-xs">{content.chain.references.map((r) => <li key={r.citation}>Template: {r.citation}{r.locator ? `, ${r.locator}` : ''}</li>)}</ul>
              {content.chain.notes && <p className="text-xs text-ink-soft">Template notes: {content.chain.notes}</p>}
            </section>
          </article>
        );
      }}
    </QueryState>
  );
}
