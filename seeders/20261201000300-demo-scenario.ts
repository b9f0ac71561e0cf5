import { db } from '@/models';
import { addComment, createCorrelation, createDraftVersion, decideVersion, submitVersion, updateDraft, withdrawVersion } from '@/lib/governance/lifecycle';
import { recordUsage } from '@/lib/api/usage';
import { DEMO_PASSWORD, demoActor } from './20261201000100-demo-users';

export const name = '20261201000300-demo-scenario';

/*
 * The demo scenario is invented: Brightwater Thermal Systems sizes the cooling of its TW-7 outdoor
 * telecom cabinet. Its methods group keeps two in-house correlations from its own (invented) test
 * rig next to the standard library; one version was withdrawn after a calibration error.
 */
const REPORT = 'Brightwater Thermal Systems, test report BTS-TR-2026-014, louvre panel LP-40 (invented demo data)';

function louvre(k0: number) {
  return {
    schemaVersion: 1,
    title: 'Brightwater LP-40 louvre panel, pressure-loss coefficient (in-house)',
    summary: 'Loss coefficient K = Δp / (ρ v²/2) of the LP-40 intake louvre of the TW-7 cabinet, from the in-house test rig.',
    category: 'internal-flow', situation: 'louvre panel', tags: ['in-house', 'pressure loss', 'TW-7 cabinet'],
    inputs: [
      { symbol: 'Re_h', name: 'Reynolds number on louvre blade pitch', unit: '1' },
      { symbol: 'sigma', name: 'open-area ratio of the panel', unit: '1' },
    ],
    outputs: [{ symbol: 'K', name: 'loss coefficient based on face velocity', unit: '1', expression: `${k0} * (1/sigma - 1)^2 + 38 / Re_h^0.5` }],
    validity: [{ symbol: 'Re_h', min: 800, max: 12000, note: 'range of the rig tests' }, { symbol: 'sigma', min: 0.35, max: 0.6 }],
    references: [{ citation: REPORT, locator: 'Section 4, fit of Table 3' }],
    propertyBasis: 'Inlet air density and viscosity at the cabinet intake temperature.',
    notes: 'In-house fit for the LP-40 panel only; invented demo data.',
  };
}
function louvreCases(k0: number) {
  const K = (re: number, s: number) => Number((k0 * (1 / s - 1) ** 2 + 38 / Math.sqrt(re)).toPrecision(8));
  const row = (label: string, re: number, s: number) => ({ label, inputs: { Re_h: re, sigma: s }, expected: { K: K(re, s) }, tolerance: { rel: 0.04, why: 'rig repeatability about ±4 %' }, source: { kind: 'published', citation: REPORT, locator: `Table 3, ${label}` } });
  return [
    row('run 3', 1000, 0.4), row('run 7', 4000, 0.5), row('run 12', 10000, 0.58),
    { label: 'outside the tested range', inputs: { Re_h: 20000, sigma: 0.5 }, expected: {}, tolerance: { rel: 1e-9 }, source: { kind: 'common-practice', citation: 'validity range of the rig tests' }, expectWarnings: ['Re_h'] },
  ];
}

const finArray = {
  schemaVersion: 1,
  title: 'Brightwater HS-12 fin array, natural convection (in-house)',
  summary: 'Average Nusselt number of the vertical HS-12 heat-sink fin array of the TW-7 rectifier, from in-house measurements.',
  category: 'free-convection', situation: 'vertical fin array, free convection', tags: ['in-house', 'heat sink', 'TW-7 cabinet'],
  inputs: [{ symbol: 'Ra_s', name: 'Rayleigh number on fin spacing', unit: '1' }],
  outputs: [{ symbol: 'Nu_s', name: 'average Nusselt number on fin spacing', unit: '1', expression: '(576/Ra_s^2 + 2.873/Ra_s^0.5)^(-1/2) * 1.07' }],
  validity: [{ symbol: 'Ra_s', min: 10, max: 1e4 }],
  references: [{ citation: 'Brightwater Thermal Systems, test report BTS-TR-2026-021, HS-12 heat sink (invented demo data)', locator: 'Figure 5' }],
  propertyBasis: 'Film temperature between fin surface and cabinet air.',
  notes: 'Shape of the Bar-Cohen & Rohsenow (1984) optimum-spacing composite, scaled by an in-house factor 1.07. Draft: awaiting the second test series.',
};

export async function up(): Promise<void> {
  const { Correlation } = db();
  const author = await demoActor('author@demo.example');
  const approver = await demoActor('approver@demo.example');
  const approver2 = await demoActor('approver2@demo.example');
  const engineer = await demoActor('engineer@demo.example');
  const integrator = await demoActor('integrator@demo.example');

  if (!(await Correlation.findOne({ where: { slug: 'brightwater-louvre-pressure-loss' } }))) {
    const slug = 'brightwater-louvre-pressure-loss';
    await createCorrelation({ actor: author, slug, definition: louvre(1.9), checkCases: louvreCases(1.9) });
    await submitVersion({ actor: author, slug, version: 1 });
    await decideVersion({ actor: approver, slug, version: 1, decision: 'approve', comment: 'Fit agrees with Table 3 within rig repeatability.', password: DEMO_PASSWORD });
    // The TW-7 sizing sheet and the integrator's script used version 1 before the error was found.
    const { CorrelationVersion } = db();
    const c = await Correlation.findOne({ where: { slug } });
    const v1 = await CorrelationVersion.findOne({ where: { correlationId: c!.id, version: 1 } });
    recordUsage({ userId: engineer.id, tokenId: null, versionId: v1!.id, evaluations: 14 });
    recordUsage({ userId: integrator.id, tokenId: null, versionId: v1!.id, evaluations: 220 });
    await withdrawVersion({ actor: approver2, slug, version: 1, reason: 'The rig flow meter was found out of calibration (reads 6 % high); K values of test series 1 are too low. Do not use for TW-7 fan selection.' });
    await createDraftVersion({ actor: author, slug, fromVersion: 1 });
    await updateDraft({ actor: author, slug, version: 2, definition: louvre(2.1), checkCases: louvreCases(2.1) });
    await submitVersion({ actor: author, slug, version: 2 });
    await addComment({ actor: approver, slug, version: 2, body: 'Please attach the recalibration certificate of the flow meter to the report before I sign.' });
  }

  if (!(await Correlation.findOne({ where: { slug: 'brightwater-fin-array-natural-convection' } }))) {
    await createCorrelation({
      actor: author, slug: 'brightwater-fin-array-natural-convection', definition: finArray,
      checkCases: [{ label: 'series 1, fin pitch 8 mm', inputs: { Ra_s: 500 }, expected: { Nu_s: 3.1 }, tolerance: { rel: 0.05, why: 'measurement uncertainty ±5 %' }, source: { kind: 'published', citation: 'Brightwater test report BTS-TR-2026-021 (invented demo data)', locator: 'Figure 5' } }],
    });
  }

  // The methods engineer has started a revision of Hilpert's table (still a draft).
  const hilpert = await Correlation.findOne({ where: { slug: 'cylinder-crossflow-hilpert' } });
  if (hilpert && !(await db().CorrelationVersion.findOne({ where: { correlationId: hilpert.id, version: 2 } }))) {
    await createDraftVersion({ actor: author, slug: 'cylinder-crossflow-hilpert' });
  }
}

export async function down(): Promise<void> {
  const { Correlation } = db();
  await Correlation.destroy({ where: { slug: ['brightwater-louvre-pressure-loss', 'brightwater-fin-array-natural-convection'] } });
}
