'use client';

import type { CheckCase } from '@/lib/engine/types';
import type { ValidationReport } from '@/lib/engine/validate';
import { formatNumber } from '@/lib/client/units';
import { EvidenceSummary } from './evidence-summary';

/** One line per stage of validation, in the words of a reviewer rather than a build log. */
function stageWords(stage: string, passed: boolean, report: ValidationReport): string {
  switch (stage) {
    case 'schema': return passed ? 'The definition is complete and well-formed.' : 'The definition is incomplete or malformed.';
    case 'expressions': return passed ? 'Every formula parses and uses allowed functions only.' : 'A formula cannot be read or uses something not allowed.';
    case 'symbols': return passed ? 'Every symbol is declared once and used after it is computed.' : 'A symbol is undeclared, declared twice or used before it is computed.';
    case 'dimensions': return passed ? 'Units are consistent throughout.' : 'Units do not agree somewhere.';
    case 'check-cases': return `Check cases reproduced: ${report.summary.passed} of ${report.summary.checkCases}.`;
    case 'coverage': return passed ? `The check cases cover the validity ranges: ${report.coverage.message}.` : `The check cases leave parts of the ranges untested: ${report.coverage.message}.`;
    default: return `${stage}: ${passed ? 'passed' : 'failed'}.`;
  }
}

/** Where a problem is, in words: "/outputs/0/expression" → "output 1, formula". */
function fieldOf(pointer: string): string {
  const parts = pointer.split('/').filter(Boolean);
  if (!parts.length) return 'definition';
  const names: Record<string, string> = { inputs: 'input', outputs: 'output', steps: 'step', constants: 'constant', validity: 'range', references: 'reference', checkCases: 'check case', expression: 'formula', residual: 'residual', unit: 'unit', symbol: 'symbol' };
  return parts.map((p) => (/^\d+$/.test(p) ? String(Number(p) + 1) : names[p] ?? p)).join(' ').replace(/ (\d+)/g, ' $1,').replace(/,$/, '');
}

/** The validation report: what each stage found, then every check case with computed, expected and error. */
export function ValidationReportView({ report, checkCases, title = 'Validation report and check cases', emptyText }: { report: ValidationReport | null; checkCases: CheckCase[]; title?: string; emptyText?: string }) {
  return (
    <section className="panel space-y-3" aria-label="Validation report">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="mr-auto font-semibold">{title}</h2>
        {report && <span className={`rounded px-2 py-0.5 text-sm font-medium ${report.passed ? 'bg-ok-bg text-ok' : 'bg-danger-bg text-danger'}`}>{report.passed ? 'Validation passed' : 'Validation found problems'} · {report.summary.passed} of {report.summary.checkCases} check cases reproduced</span>}
      </div>
      {!report && <p className="text-sm text-ink-faint">{emptyText ?? `Not validated yet: validation runs when the version is submitted (${checkCases.length} check case${checkCases.length === 1 ? '' : 's'} stored).`}</p>}
      {report && (
        <>
          <ul className="grid gap-1 text-sm sm:grid-cols-2" aria-label="What the validation found">
            {report.stages.map((st) => {
              const words = stageWords(st.stage, st.passed, report);
              return (
                <li key={st.stage} className="flex gap-2">
                  <span className={`mt-0.5 inline-block w-16 shrink-0 rounded px-1 text-center text-xs font-medium ${st.passed ? 'bg-ok-bg text-ok' : st.stage === 'coverage' ? 'bg-caution-bg text-caution' : 'bg-danger-bg text-danger'}`}>{st.passed ? 'yes' : st.stage === 'coverage' ? 'partly' : 'no'}</span>
                  <span>{words}</span>
                </li>
              );
            })}
          </ul>
          {report.stages.flatMap((st) => st.issues).length > 0 && (
            <ul className="space-y-1 text-sm">
              {report.stages.flatMap((st) => st.issues).map((i, k) => <li key={k} className={i.stage === 'coverage' ? 'text-caution' : 'text-danger'}><span className="text-xs text-ink-soft">{fieldOf(i.pointer)}:</span> {i.message}</li>)}
            </ul>
          )}
          <EvidenceSummary evidence={report.evidence} />
          {report.cases.length > 0 && (
            <div className="overflow-x-auto">
              <table className="table-plain">
                <thead><tr><th scope="col">Case</th><th scope="col">Source</th><th scope="col">Output</th><th scope="col">Computed</th><th scope="col">Expected</th><th scope="col">Difference</th><th scope="col">Allowed</th><th scope="col">Result</th></tr></thead>
                <tbody>
                  {report.cases.flatMap((c) => (c.outputs.length ? c.outputs : [null]).map((o, k) => (
                    <tr key={`${c.index}-${k}`} className={c.passed ? '' : 'bg-danger-bg'}>
                      {k === 0 && <td rowSpan={Math.max(1, c.outputs.length)}>{c.label}{c.expectedWarnings.length > 0 && <div className="text-xs text-caution">expects warning on {c.expectedWarnings.join(', ')}</div>}{c.problems.map((p, j) => <div key={j} className="text-xs text-danger">{p}</div>)}</td>}
                      {k === 0 && <td rowSpan={Math.max(1, c.outputs.length)} className="max-w-xs text-xs"><span className="font-medium">{c.sourceKind}</span> — {c.citation}{c.locator && `, ${c.locator}`}{checkCases[c.index]?.source.attachment && <> · <a className="text-brand-dark underline" href={`#document-${c.index}`}>source document</a></>}</td>}
                      <td className="font-mono text-xs">{o?.symbol ?? '—'}</td>
                      <td className="font-mono text-xs">{formatNumber(o?.computed ?? null, 7)}</td>
                      <td className="font-mono text-xs">{o ? formatNumber(o.expected, 7) : '—'}</td>
                      <td className="font-mono text-xs">{o?.error !== null && o ? formatNumber(o.error, 3) : '—'}</td>
                      <td className="font-mono text-xs">{o ? formatNumber(o.allowed, 3) : '—'}</td>
                      {k === 0 && <td rowSpan={Math.max(1, c.outputs.length)}>{c.passed ? <span className="text-ok">reproduced</span> : <span className="font-medium text-danger">not reproduced</span>}</td>}
                    </tr>
                  )))}
                </tbody>
              </table>
            </div>
          )}
          <SourceDocuments checkCases={checkCases} />
        </>
      )}
    </section>
  );
}

/** The evidence documents behind the check cases, each openable inline (images and PDF pages) beside its case. */
function SourceDocuments({ checkCases }: { checkCases: CheckCase[] }) {
  const docs = checkCases.map((c, index) => ({ c, index, a: c.source.attachment })).filter((d) => d.a);
  if (!docs.length) return null;
  return (
    <div className="space-y-2" aria-label="Source documents" role="region">
      <h3 className="text-sm font-semibold">Source documents ({docs.length})</h3>
      {docs.map(({ c, index, a }) => (
        <details key={index} id={`document-${index}`} className="rounded border border-line p-2 text-sm">
          <summary className="cursor-pointer">
            <span className="font-medium">{c.label}</span> — {a!.name} <span className="font-mono text-xs text-ink-faint" title={`SHA-256 ${a!.sha256}`}>sha256 {a!.sha256.slice(0, 12)}…</span>
          </summary>
          <div className="mt-2 space-y-1">
            {a!.mediaType === 'application/pdf'
              ? <object data={`/api/attachments/${a!.id}`} type="application/pdf" className="h-[32rem] w-full rounded border border-line" aria-label={`${a!.name}, the source of ${c.label}`}><p>Your browser shows no PDFs here; <a className="underline" href={`/api/attachments/${a!.id}`}>open the document</a>.</p></object>
              : <img src={`/api/attachments/${a!.id}`} alt={`${a!.name}, the source of ${c.label}`} className="max-h-[32rem] max-w-full rounded border border-line" />}
            <a className="text-xs text-brand-dark underline" href={`/api/attachments/${a!.id}`} target="_blank" rel="noreferrer">Open {a!.name} in a new tab</a>
          </div>
        </details>
      ))}
    </div>
  );
}
