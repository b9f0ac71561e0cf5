import Papa from 'papaparse';
import { checkCheckCaseSchema } from '@/lib/engine/schema';
import type { CheckCase, Definition, SourceKind } from '@/lib/engine/types';

export const CSV_MAX_BYTES = 1_000_000;
export const CSV_MAX_ROWS = 1000;

export interface CsvRow {
  line: number;
  checkCase: CheckCase | null;
  errors: string[];
}

/**
 * Reads check cases from CSV. Columns: label; one per input symbol (a unit may follow in brackets,
 * "T [degC]"); expected:<output> per output; rel and/or abs (tolerance); why; source_kind; citation;
 * locator; expect_warnings (symbols separated by spaces). Every row is checked; nothing is kept from
 * a row with errors.
 */
export function parseCheckCaseCsv(text: string, definition: Pick<Definition, 'inputs' | 'outputs'>): { rows: CsvRow[]; fileErrors: string[] } {
  const fileErrors: string[] = [];
  if (new Blob([text]).size > CSV_MAX_BYTES) return { rows: [], fileErrors: [`The file is larger than ${CSV_MAX_BYTES / 1e6} MB.`] };
  const parsed = Papa.parse<Record<string, string>>(text.trim(), { header: true, skipEmptyLines: true, transformHeader: (h) => h.trim() });
  if (parsed.data.length > CSV_MAX_ROWS) return { rows: [], fileErrors: [`The file has ${parsed.data.length} rows; at most ${CSV_MAX_ROWS} are accepted.`] };
  const headers = parsed.meta.fields ?? [];
  const inputs = new Map(definition.inputs.map((i) => [i.symbol, i.unit]));
  const outputs = new Set(definition.outputs.map((o) => o.symbol));
  const known = new Set(['label', 'rel', 'abs', 'why', 'source_kind', 'citation', 'locator', 'expect_warnings']);
  const inputColumns: { header: string; symbol: string; unit?: string }[] = [];
  const expectedColumns: { header: string; symbol: string }[] = [];
  for (const h of headers) {
    const m = /^([A-Za-z][A-Za-z0-9_]*)\s*(?:\[(.+)\])?$/.exec(h);
    if (h.startsWith('expected:')) {
      const symbol = h.slice('expected:'.length).trim();
      if (!outputs.has(symbol)) fileErrors.push(`Column "${h}": "${symbol}" is not an output (outputs: ${[...outputs].join(', ')}).`);
      else expectedColumns.push({ header: h, symbol });
    } else if (known.has(h)) {
      continue;
    } else if (m && inputs.has(m[1])) {
      inputColumns.push({ header: h, symbol: m[1], unit: m[2]?.trim() });
    } else {
      fileErrors.push(`Column "${h}" is not an input (${[...inputs.keys()].join(', ')}), an expected:<output> column or one of ${[...known].join(', ')}.`);
    }
  }
  for (const s of inputs.keys()) if (!inputColumns.some((c) => c.symbol === s)) fileErrors.push(`No column for the input "${s}".`);
  if (!headers.includes('label')) fileErrors.push('No "label" column.');
  if (fileErrors.length) return { rows: [], fileErrors };

  const rows = parsed.data.map((r, k): CsvRow => {
    const line = k + 2;
    const errors: string[] = [];
    const num = (header: string, value: string | undefined, required: boolean): number | undefined => {
      if (value === undefined || value.trim() === '') { if (required) errors.push(`${header}: empty`); return undefined; }
      const n = Number(value);
      if (!Number.isFinite(n)) { errors.push(`${header}: "${value}" is not a number`); return undefined; }
      return n;
    };
    const caseInputs: CheckCase['inputs'] = {};
    for (const c of inputColumns) {
      const v = num(c.header, r[c.header], true);
      if (v !== undefined) caseInputs[c.symbol] = c.unit ? { value: v, unit: c.unit } : v;
    }
    const expected: Record<string, number> = {};
    for (const c of expectedColumns) {
      const v = num(c.header, r[c.header], false);
      if (v !== undefined) expected[c.symbol] = v;
    }
    const rel = num('rel', r.rel, false);
    const abs = num('abs', r.abs, false);
    const warnings = (r.expect_warnings ?? '').split(/\s+/).filter(Boolean);
    const bad = warnings.filter((w) => !inputs.has(w) && !outputs.has(w));
    if (bad.length) errors.push(`expect_warnings: ${bad.join(', ')} not a symbol of this correlation`);
    const candidate: CheckCase = {
      label: (r.label ?? '').trim(),
      inputs: caseInputs,
      expected,
      tolerance: { ...(rel !== undefined ? { rel } : {}), ...(abs !== undefined ? { abs } : {}), ...(r.why?.trim() ? { why: r.why.trim() } : {}) },
      source: { kind: (r.source_kind ?? '').trim() as SourceKind, citation: (r.citation ?? '').trim(), ...(r.locator?.trim() ? { locator: r.locator.trim() } : {}) },
      ...(warnings.length ? { expectWarnings: warnings } : {}),
    };
    if (!errors.length) errors.push(...checkCheckCaseSchema(candidate).map((i) => `${i.pointer === '/' ? 'row' : i.pointer.slice(1).replace(/\//g, '.')}: ${i.message}`));
    if (!errors.length && Object.keys(expected).length === 0 && !warnings.length) errors.push('give at least one expected:<output> value (or expect_warnings for an out-of-range row)');
    return { line, checkCase: errors.length ? null : candidate, errors };
  });
  return { rows, fileErrors };
}

/** The CSV columns for a definition's check cases, in the order the template and the export use. */
export function checkCaseColumns(definition: Pick<Definition, 'inputs' | 'outputs'>): string[] {
  return [
    'label',
    ...definition.inputs.map((i) => (['1', ''].includes(i.unit) ? i.symbol : `${i.symbol} [${i.unit}]`)),
    ...definition.outputs.map((o) => `expected:${o.symbol}`),
    'rel', 'abs', 'why', 'source_kind', 'citation', 'locator', 'expect_warnings',
  ];
}

/** A CSV to start from for this definition: its header and one row that says what goes where. */
export function checkCaseTemplate(definition: Pick<Definition, 'inputs' | 'outputs'>): string {
  const columns = checkCaseColumns(definition);
  const example = columns.map((c) => (c === 'label' ? 'describe the case' : c === 'rel' ? '0.02' : c === 'source_kind' ? 'published' : c === 'citation' ? 'Author (year) title, journal volume:pages' : c === 'locator' ? 'table 2, row 3' : ''));
  const quote = (s: string) => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
  return `${columns.map(quote).join(',')}\n${example.map(quote).join(',')}\n`;
}
