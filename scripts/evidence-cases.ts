/**
 * Writes the evidence plan (validation/reference/evidence-plan.ts) into the library files: every planned
 * check case is computed again and replaces the one before it; hand-written cases stay, in their order,
 * with out-of-range cases last. Cross-checks that an earlier library wrote by hand against a re-typed
 * copy of another correlation are replaced by their planned form. Prints each new case's deviation from
 * the definition against its tolerance. Usage: npm run evidence:write
 */
import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { compiled, type CheckCase, type Definition } from '@/lib/engine';
import { LIBRARY_DIR, readLibrary } from '@/lib/governance/library';
import { isPlanned, plannedCases, PYTHON_EVAL } from '@/validation/reference/evidence-plan';
import { isRetypedCrossCheck } from '@/validation/reference/formulas';

const library = readLibrary();
const python = (exprs: string[]) => JSON.parse(execFileSync('/usr/bin/python3', ['-c', PYTHON_EVAL], { input: JSON.stringify(exprs), encoding: 'utf8' })) as number[];
const planned = plannedCases(library, python);
let failing = 0;
for (const entry of library) {
  const add = planned.get(entry.slug);
  const cases = entry.checkCases as CheckCase[];
  const kept = cases.filter((c) => !isPlanned(c) && !isRetypedCrossCheck(entry.slug, c, library.map((e) => e.slug)));
  if (!add && kept.length === cases.length) continue;
  const inRange = kept.filter((c) => !c.expectWarnings?.length && !c.expectRefusal);
  const outOfRange = kept.filter((c) => c.expectWarnings?.length || c.expectRefusal);
  // A value recomputed to within rounding of the last digit (the python expressions and the solvers are not bit-stable
  // across runs) keeps the stored one, so a rewrite touches only the cases that really changed.
  for (const k of add ?? []) {
    const before = cases.find((c) => c.label === k.label && JSON.stringify(c.inputs) === JSON.stringify(k.inputs));
    if (before && Object.entries(k.expected).every(([s, v]) => before.expected[s] !== undefined && Math.abs(before.expected[s] / v - 1) < 1e-12)) k.expected = before.expected;
  }
  entry.checkCases = [...inRange, ...(add ?? []), ...outOfRange];
  const c = compiled(entry.definition as unknown as Definition);
  for (const k of add ?? []) {
    const r = c.evaluate(k.inputs);
    for (const [s, v] of Object.entries(k.expected)) {
      const dev = r.outputs[s] / v - 1;
      const ok = Math.abs(dev) <= (k.tolerance.rel ?? 0) && !r.warnings.length;
      if (!ok) failing++;
      console.log(`${ok ? '  ' : '✗ '}${entry.slug.padEnd(46)} ${k.source.kind.padEnd(21)} ${(dev * 100).toFixed(2).padStart(7)} % of ±${((k.tolerance.rel ?? 0) * 100).toFixed(1)} %  ${k.label}${r.warnings.length ? ` [warns ${r.warnings.map((w) => w.symbol)}]` : ''}`);
    }
  }
  writeFileSync(join(LIBRARY_DIR, `${entry.slug}.json`), `${JSON.stringify(entry, null, 2)}\n`);
}
console.log(failing ? `${failing} planned case(s) outside their tolerance: the correlation and the evidence disagree` : 'every planned case within its tolerance');
