'use client';

import { diffLines } from 'diff';

interface Row { left: string | null; right: string | null; kind: 'same' | 'changed' | 'removed' | 'added' }

/** Side-by-side line diff of two JSON documents (previous approved on the left, this version on the right). */
export function DefinitionDiff({ before, after, leftLabel, rightLabel }: { before: unknown; after: unknown; leftLabel: string; rightLabel: string }) {
  const a = JSON.stringify(before, null, 2);
  const b = JSON.stringify(after, null, 2);
  const parts = diffLines(a, b);
  const rows: Row[] = [];
  for (let i = 0; i < parts.length; i++) {
    const p = parts[i];
    const lines = p.value.replace(/\n$/, '').split('\n');
    if (!p.added && !p.removed) { for (const l of lines) rows.push({ left: l, right: l, kind: 'same' }); continue; }
    if (p.removed && parts[i + 1]?.added) {
      const added = parts[i + 1].value.replace(/\n$/, '').split('\n');
      for (let k = 0; k < Math.max(lines.length, added.length); k++) rows.push({ left: lines[k] ?? null, right: added[k] ?? null, kind: 'changed' });
      i++;
      continue;
    }
    for (const l of lines) rows.push(p.removed ? { left: l, right: null, kind: 'removed' } : { left: null, right: l, kind: 'added' });
  }
  const changed = rows.filter((r) => r.kind !== 'same').length;
  // Long unchanged runs fold to three lines of context on each side.
  const CONTEXT = 3;
  const near = rows.map((_, k) => rows.slice(Math.max(0, k - CONTEXT), k + CONTEXT + 1).some((r) => r.kind !== 'same'));
  const shown: (Row | { fold: number })[] = [];
  for (let k = 0; k < rows.length; k++) {
    if (near[k] || changed === 0) { shown.push(rows[k]); continue; }
    let n = 0;
    while (k + n < rows.length && !near[k + n]) n++;
    shown.push({ fold: n });
    k += n - 1;
  }
  const cell = (text: string | null, side: 'l' | 'r', kind: Row['kind']) => {
    // Before in the paper's sunk tone, after in the light teal of the version under review: which side, not good or bad.
    const bg = kind === 'same' ? '' : text === null ? 'bg-paper-sunk' : side === 'l' ? 'bg-caution-bg/50' : 'bg-brand-light/60';
    return <td className={`whitespace-pre-wrap break-all border-l border-line px-2 font-mono text-[11px] leading-5 ${bg}`}>{text ?? ''}</td>;
  };
  return (
    <div>
      <p className="mb-1 text-xs text-ink-soft">{changed === 0 ? 'No differences.' : `${changed} line${changed === 1 ? '' : 's'} differ.`}</p>
      <div className="max-h-[520px] overflow-auto rounded border border-line" tabIndex={0} role="region" aria-label="Raw definition differences">
        <table className="w-full table-fixed border-collapse" aria-label="Definition differences">
          <thead className="sticky top-0 bg-paper-sunk text-left text-xs"><tr><th className="px-2 py-1">{leftLabel}</th><th className="px-2 py-1">{rightLabel}</th></tr></thead>
          <tbody>{shown.map((r, k) => ('fold' in r
            ? <tr key={k}><td colSpan={2} className="bg-paper-sunk px-2 text-center text-[11px] text-ink-faint">… {r.fold} unchanged line{r.fold === 1 ? '' : 's'} …</td></tr>
            : <tr key={k}>{cell(r.left, 'l', r.kind)}{cell(r.right, 'r', r.kind)}</tr>))}</tbody>
        </table>
      </div>
    </div>
  );
}
