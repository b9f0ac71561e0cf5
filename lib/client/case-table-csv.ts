import Papa from 'papaparse';
import type { InputDef } from '@/lib/engine/types';

/**
 * A table of cases for a parametric run, read from CSV: one column per input, named by its symbol,
 * optionally with a unit in brackets ("T_inf [degC]"); otherwise the input's declared unit. Every bad
 * cell is reported by row and column; nothing is dropped silently.
 */
export interface CaseTable { rows: Record<string, number | { value: number; unit: string }>[]; problems: string[] }

export const MAX_CASE_ROWS = 10_000;

export function parseCaseTable(text: string, inputs: InputDef[]): CaseTable {
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: 'greedy' });
  const problems: string[] = parsed.errors.slice(0, 5).map((e) => `line ${(e.row ?? 0) + 1}: ${e.message}`);
  const [header, ...body] = parsed.data;
  if (!header) return { rows: [], problems: ['The table is empty: the first line names the inputs, e.g. ' + inputs.map((i) => i.symbol).join(',')] };
  const columns = header.map((h) => {
    const m = /^\s*([A-Za-z][A-Za-z0-9_]*)\s*(?:\[\s*([^\]]*)\s*\])?\s*$/.exec(h);
    return m ? { symbol: m[1], unit: m[2]?.trim() || null } : { symbol: h.trim(), unit: null };
  });
  for (const c of columns) if (!inputs.some((i) => i.symbol === c.symbol)) problems.push(`column "${c.symbol}" is not an input (inputs: ${inputs.map((i) => i.symbol).join(', ')})`);
  for (const i of inputs) if (!columns.some((c) => c.symbol === i.symbol)) problems.push(`column "${i.symbol}" (${i.name}) is missing`);
  if (body.length > MAX_CASE_ROWS) problems.push(`${body.length} rows: at most ${MAX_CASE_ROWS} in one run`);
  const rows: CaseTable['rows'] = [];
  body.slice(0, MAX_CASE_ROWS).forEach((cells, r) => {
    const row: CaseTable['rows'][number] = {};
    columns.forEach((c, k) => {
      const raw = (cells[k] ?? '').trim();
      const n = Number(raw);
      if (raw === '' || !Number.isFinite(n)) { if (problems.length < 50) problems.push(`row ${r + 1}, column ${c.symbol}: "${raw}" is not a number`); return; }
      const declared = inputs.find((i) => i.symbol === c.symbol)?.unit;
      row[c.symbol] = c.unit && c.unit !== declared ? { value: n, unit: c.unit } : n;
    });
    rows.push(row);
  });
  return { rows, problems };
}

/** A CSV to start from: the header with declared units and one example row. */
export function caseTableTemplate(inputs: InputDef[], example?: Record<string, unknown>): string {
  const header = inputs.map((i) => (['1', ''].includes(i.unit) ? i.symbol : `${i.symbol} [${i.unit}]`)).join(',');
  const row = inputs.map((i) => {
    const v = example?.[i.symbol];
    return typeof v === 'number' ? v : v && typeof v === 'object' && 'value' in v ? '' : '';
  }).join(',');
  return `${header}\n${row}\n`;
}

export function toCsv(lines: (string | number | null | undefined)[][]): string {
  return `${lines.map((l) => l.map((v) => { const s = v === null || v === undefined ? '' : String(v); return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s; }).join(',')).join('\n')}\n`;
}

export function download(filename: string, text: string, type = 'text/csv') {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  a.click();
  URL.revokeObjectURL(url);
}
