import { db } from '@/models';
import { addComment, createCorrelation, createDraftVersion, decideVersion, submitVersion, updateDraft, withdrawVersion } from '@/lib/governance/lifecycle';
import { recordUsage } from '@/lib/api/usage';
import { createProject, setProjectMember } from '@/lib/calculations/projects';
import { saveCalculation } from '@/lib/calculations/records';
import { QueryTypes } from 'sequelize';
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

export const DEMO_PROJECT = 'TW-7 outdoor telecom cabinet: thermal design';

/** The engineer's project for the TW-7 cabinet; the approver reviews it, the methods engineer may edit. */
export async function demoProject() {
  const { Project } = db();
  const found = await Project.findOne({ where: { name: DEMO_PROJECT } });
  if (found) return found;
  const engineer = await demoActor('engineer@demo.example');
  const { id } = await createProject({ actor: engineer, name: DEMO_PROJECT, description: 'Cooling of the TW-7 outdoor cabinet (invented demo scenario): door and wall heat loss, rectifier cold plate, intake louvre and fan selection.' });
  await setProjectMember({ actor: engineer, projectId: id, email: 'author@demo.example', role: 'editor' });
  await setProjectMember({ actor: engineer, projectId: id, email: 'approver@demo.example', role: 'reviewer' });
  return (await Project.findByPk(id))!;
}

/** A chain of the engineer's own: air density at the intake, blade Reynolds number, the louvre's K, Δp. */
async function louvreChain() {
  const { sequelize } = db();
  const hash = async (slug: string, version: number) => (await sequelize.query<{ h: string }>(
    'SELECT v.content_hash AS h FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id WHERE c.slug = ? AND v.version = ?',
    { replacements: [slug, version], type: QueryTypes.SELECT }))[0].h;
  return {
    schemaVersion: 1, kind: 'template', title: 'Intake louvre pressure drop', summary: 'Pressure drop of the LP-40 intake louvre at a face velocity: air properties, density at the site pressure, blade Reynolds number, loss coefficient.',
    category: 'internal-flow', situation: 'louvre panel',
    inputs: [
      { symbol: 'u_face', name: 'face velocity', unit: 'm/s' }, { symbol: 'b', name: 'blade pitch', unit: 'm' }, { symbol: 'sigma', name: 'open-area ratio', unit: '1' },
      { symbol: 'T', name: 'intake air temperature', unit: 'K' }, { symbol: 'p', name: 'site pressure', unit: 'Pa' },
    ],
    constants: [{ symbol: 'M_air', name: 'molar mass of dry air', value: 0.0289647, unit: 'kg/mol' }],
    steps: [
      { key: 'air', kind: 'correlation', title: 'Air viscosity at the intake', use: { slug: 'air-properties-1atm', version: 1, contentHash: await hash('air-properties-1atm', 1) }, inputs: { T: 'T' }, outputs: { mu: 'mu' } },
      { key: 'density', kind: 'correlation', title: 'Air density at the site pressure', use: { slug: 'ideal-gas-density', version: 1, contentHash: await hash('ideal-gas-density', 1) }, inputs: { p: 'p', T: 'T', M: 'M_air' }, outputs: { rho: 'rho' } },
      { key: 'reynolds', kind: 'expression', title: 'Blade-pitch Reynolds number', outputs: [{ symbol: 'Re_h', name: 'Reynolds number on blade pitch', unit: '1', expression: 'rho * u_face * b / mu' }] },
      { key: 'loss', kind: 'correlation', title: 'LP-40 loss coefficient', use: { slug: 'brightwater-louvre-pressure-loss', version: 1, contentHash: await hash('brightwater-louvre-pressure-loss', 1) }, inputs: { Re_h: 'Re_h', sigma: 'sigma' }, outputs: { K: 'K' } },
      { key: 'pressure-drop', kind: 'expression', title: 'Pressure drop', outputs: [{ symbol: 'dp', name: 'pressure drop across the louvre', unit: 'Pa', expression: 'K * rho * u_face^2 / 2' }] },
    ],
    outputs: [{ symbol: 'Re_h', name: 'Reynolds number on blade pitch' }, { symbol: 'K', name: 'loss coefficient' }, { symbol: 'dp', name: 'pressure drop' }],
    references: [{ citation: REPORT, locator: 'Section 4' }],
  };
}

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
    await decideVersion({ actor: approver, slug, version: 1, decision: 'approve', comment: 'Fit agrees with Table 3 within rig repeatability.', password: DEMO_PASSWORD, waiver: 'In-house fit of our own louvre: the rig runs are the only data there are (one kind of evidence).' });
    // The TW-7 sizing sheet and the integrator's script used version 1 before the error was found.
    const { CorrelationVersion } = db();
    const c = await Correlation.findOne({ where: { slug } });
    const v1 = await CorrelationVersion.findOne({ where: { correlationId: c!.id, version: 1 } });
    recordUsage({ userId: engineer.id, tokenId: null, versionId: v1!.id, evaluations: 14 });
    recordUsage({ userId: integrator.id, tokenId: null, versionId: v1!.id, evaluations: 220 });
    // The engineer's intake-louvre calculation for the TW-7 fan selection was saved with version 1.
    const project = await demoProject();
    await saveCalculation({ actor: engineer, tokenId: null, request: { project: project.id, title: 'TW-7 intake louvre pressure drop at the design air flow', note: 'fan selection, first pass', chain: await louvreChain(), inputs: { u_face: 2.4, b: { value: 18, unit: 'mm' }, sigma: 0.45, T: { value: 35, unit: 'degC' }, p: { value: 99.5, unit: 'kPa' } } } });
    await withdrawVersion({ actor: approver2, slug, version: 1, reason: 'The rig flow meter was found out of calibration (reads 6 % high); K values of test series 1 are too low. Do not use for TW-7 fan selection.', password: DEMO_PASSWORD });
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
  await db().Project.destroy({ where: { name: DEMO_PROJECT } });
  await Correlation.destroy({ where: { slug: ['brightwater-louvre-pressure-loss', 'brightwater-fin-array-natural-convection'] } });
}
