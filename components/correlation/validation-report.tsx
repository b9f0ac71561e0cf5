'use client';

import type { CheckCase } from '@/lib/engine/types';
import type { ValidationReport } from '@/lib/engine/validate';
import { formatNumber } from '@/lib/client/units';
import { EvidenceSummary } from './evidence-summary';

/** The validation report: stages, then every check case with computed, expected and error. */
export function ValidationReportView({ report, checkCases, title = 'Validation report and check cases', emptyText }: { report: ValidationReport | null; checkCases: CheckCase[]; title?: string; emptyText?: string }) {
  return (
    <section className="panel space-y-3" aria-label="Validation report">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="mr-auto font-semibold">{title}</h2>
        {report && <span className={`rounded px-2 py-0.5 text-sm font-medium ${report.passed ? 'bg-ok-bg text-ok' : 'bg-danger-bg text-danger'}`}>{report.passed ? 'passed' : 'failed'} · {report.summary.passed}/{report.summary.checkCases} check cases · engine {report.engineVersion}</span>}
      </div>
      {!report && <p className="text-sm text-ink-faint">{emptyText ?? `Not validated yet: validation runs when the version is submitted (${checkCases.length} check case${checkCases.length === 1 ? '' : 's'} stored).`}</p>}
      {report && (
        <>
          <ol className="flex flex-wrap gap-2 text-xs">
            {report.stages.map((s) => <li key={s.stage} className={`rounded border px-2 py-0.5 ${s.passed ? 'border-ok/30 bg-ok-bg text-ok' : s.stage === 'coverage' ? 'border-caution-line bg-caution-bg text-caution' : 'border-danger/30 bg-danger-bg text-danger'}`}>{s.passed ? '✓' : s.stage === 'coverage' ? '!' : '✗'} {s.stage}</li>)}
          </ol>
          {report.stages.flatMap((s) => s.issues).length > 0 && (
            <ul className="space-y-1 text-sm">
              {report.stages.flatMap((s) => s.issues).map((i, k) => <li key={k} className={i.stage === 'coverage' ? 'text-caution' : 'text-danger'}><code className="text-xs">{i.pointer}</code> {i.message}</li>)}
            </ul>
          )}
          <p className="text-xs text-ink-soft">Coverage: {report.coverage.message}.</p>
          <EvidenceSummary evidence={report.evidence} />
          {report.cases.length > 0 && (
            <div className="overflow-x-auto">
              <table className="table-plain">
                <thead><tr><th>Case</th><th>Source</th><th>Output</th><th>Computed</th><th>Expected</th><th>Error</th><th>Allowed</th><th>Result</th></tr></thead>
                <tbody>
                  {report.cases.flatMap((c) => (c.outputs.length ? c.outputs : [null]).map((o, k) => (
                    <tr key={`${c.index}-${k}`} className={c.passed ? '' : 'bg-danger-bg'}>
                      {k === 0 && <td rowSpan={Math.max(1, c.outputs.length)}>{c.label}{c.expectedWarnings.length > 0 && <div className="text-xs text-caution">expects warning on {c.expectedWarnings.join(', ')}</div>}{c.problems.map((p, j) => <div key={j} className="text-xs text-danger">{p}</div>)}</td>}
                      {k === 0 && <td rowSpan={Math.max(1, c.outputs.length)} className="max-w-xs text-xs"><span className="font-medium">{c.sourceKind}</span> — {c.citation}{c.locator && `, ${c.locator}`}</td>}
                      <td className="font-mono text-xs">{o?.symbol ?? '—'}</td>
                      <td className="font-mono text-xs">{formatNumber(o?.computed ?? null, 7)}</td>
                      <td className="font-mono text-xs">{o ? formatNumber(o.expected, 7) : '—'}</td>
                      <td className="font-mono text-xs">{o?.error !== null && o ? formatNumber(o.error, 3) : '—'}</td>
                      <td className="font-mono text-xs">{o ? formatNumber(o.allowed, 3) : '—'}</td>
                      {k === 0 && <td rowSpan={Math.max(1, c.outputs.length)}>{c.passed ? <span className="text-ok">pass</span> : <span className="font-medium text-danger">fail</span>}</td>}
                    </tr>
                  )))}
                </tbody>
              </table>
            </div>
          )}
        </>
      )}
    </section>
  );
}
