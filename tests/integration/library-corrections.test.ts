import { afterAll, describe, expect, it } from 'vitest';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { readLibrary } from '@/lib/governance/library';
import { createCorrelation, decideVersion, submitVersion } from '@/lib/governance/lifecycle';
import { canonicalJson } from '@/lib/engine/canonical';
import { compiled, type CheckCase, type Definition } from '@/lib/engine';
import { DEMO_PASSWORD, demoActor } from '@/seeders/20261201000100-demo-users';
import { applyCorrections, CORRECTIONS } from '@/seeders/20261205000100-library-corrections';

/**
 * A library definition corrected after approval reaches an installation that holds the old version as a new
 * version through the life cycle. Exercised on a copy under a fresh slug, so the shared library stays as seeded.
 */
describe('standard-library corrections', () => {
  afterAll(() => closeSequelize());
  const GG = 'tube-bank-pressure-drop-gaddis-gnielinski-aligned';
  const file = readLibrary().find((e) => e.slug === GG)!;
  // Version 1 as first approved: the laminar term's denominator read (4ab/π − 1) instead of (4ab − π).
  const step = (file.definition.steps as { expression: string }[])[0];
  const oldDefinition = { ...file.definition, steps: [{ ...step, expression: step.expression.replace('(4 * a * b - pi)', '(4 * a * b / pi - 1)') }] };
  const oldCases = (file.checkCases as CheckCase[]).filter((c) => c.source.kind !== 'independent-solution');

  it('the Stokes-flow check cases tell the two versions apart: the old laminar term is π times too large', () => {
    expect(step.expression).toContain('(4 * a * b - pi)');
    const at = { Re_Dmax: 1, a: 3, b: 3, N_L: 10 };
    const now = compiled(file.definition as unknown as Definition).evaluate(at).outputs.Eu;
    const before = compiled(oldDefinition as unknown as Definition).evaluate(at).outputs.Eu;
    // Kuwabara (1959) cell model at φ = π/36: F/μU = 4π/(−½ ln φ − ¾ + φ − φ²/4); Eu = 2 (F/μU)(a − 1)/(a² Re).
    const phi = Math.PI / 36;
    const stokes = (2 * (4 * Math.PI / (-0.5 * Math.log(phi) - 0.75 + phi - phi * phi / 4)) * 2) / 9;
    expect(Math.abs(now / stokes - 1)).toBeLessThan(0.361);
    expect(before / stokes - 1).toBeGreaterThan(1.5);
  });

  it('gives an installation holding the old version a new approved version equal to the file, superseding the old', async () => {
    expect(Object.keys(CORRECTIONS)).toContain(GG);
    const author = await demoActor('author@demo.example');
    const approver = await demoActor('approver2@demo.example');
    const slug = `correction-fixture-${Date.now()}`;
    await createCorrelation({ actor: author, slug, definition: oldDefinition, checkCases: oldCases });
    await submitVersion({ actor: author, slug, version: 1 });
    await decideVersion({ actor: approver, slug, version: 1, decision: 'approve', comment: 'as first approved', password: DEMO_PASSWORD });

    const made = await applyCorrections({ [slug]: 'the laminar term' }, [{ ...file, slug }]);
    expect(made).toEqual([{ slug, version: 2 }]);
    const { Correlation, CorrelationVersion } = db();
    const c = await Correlation.findOne({ where: { slug } });
    const versions = await CorrelationVersion.findAll({ where: { correlationId: c!.id }, order: [['version', 'ASC']] });
    expect(versions.map((v) => v.status)).toEqual(['superseded', 'approved']);
    expect(canonicalJson(versions[1].definition)).toBe(canonicalJson(file.definition));
    // Run again: nothing left to correct.
    expect(await applyCorrections({ [slug]: 'the laminar term' }, [{ ...file, slug }])).toEqual([]);
  });
});
