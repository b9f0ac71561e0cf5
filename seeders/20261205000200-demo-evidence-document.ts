import { db } from '@/models';
import { createCorrelation, decideVersion, submitVersion } from '@/lib/governance/lifecycle';
import { uploadAttachment } from '@/lib/evidence/attachments';
import { simplePdf } from '@/lib/evidence/demo-document';
import { DEMO_PASSWORD, demoActor } from './20261201000100-demo-users';

export const name = '20261205000200-demo-evidence-document';

const SLUG = 'brightwater-cp3-cold-plate-channel';
const REPORT = 'Brightwater Thermal Systems, test report BTS-TR-2026-030, CP-3 cold plate (invented demo data)';

/** Invented "measurements": the fit times small rig scatter, as a demo report's Table 2 would list them. */
const RUNS = [
  { label: 'run 2', Re_ch: 400, Pr: 6.8, scatter: 1.012 },
  { label: 'run 5', Re_ch: 1200, Pr: 5.9, scatter: 0.991 },
  { label: 'run 9', Re_ch: 2600, Pr: 4.4, scatter: 1.021 },
];
const fit = (re: number, pr: number) => 0.21 * re ** 0.62 * pr ** (1 / 3);

/**
 * The demo's evidence document: an approved in-house correlation whose check cases point at the page of an invented,
 * clearly labelled test report, uploaded to the document store like an author would. Its SHA-256 is in the version's hash.
 */
export async function up(): Promise<void> {
  const { Correlation } = db();
  if (await Correlation.findOne({ where: { slug: SLUG } })) return;
  const author = await demoActor('author@demo.example');
  const approver = await demoActor('approver@demo.example');
  const rows = RUNS.map((r) => ({ ...r, Nu_ch: Number((fit(r.Re_ch, r.Pr) * r.scatter).toPrecision(4)) }));
  const pdf = simplePdf([
    'INVENTED DEMO DOCUMENT - not a real test report',
    'Brightwater Thermal Systems (an invented company), test report BTS-TR-2026-030',
    'CP-3 cold plate of the TW-7 rectifier: channel heat transfer, water-glycol 30 %',
    '',
    'Table 2. Average Nusselt number on the channel hydraulic diameter',
    ...rows.map((r) => `${r.label}:   Re_ch = ${r.Re_ch}   Pr = ${r.Pr}   Nu_ch = ${r.Nu_ch}`),
    '',
    'Uncertainty of Nu_ch: +/- 5 % (rig calibration, invented).',
  ]);
  const doc = await uploadAttachment({ actor: author, name: 'BTS-TR-2026-030 table 2 (invented demo).pdf', content: Buffer.from(pdf).toString('base64') });
  const attachment = { id: doc.id, sha256: doc.sha256, mediaType: doc.mediaType, name: doc.name };
  const definition = {
    schemaVersion: 1,
    title: 'Brightwater CP-3 cold plate, channel Nusselt number (in-house)',
    summary: 'Average Nusselt number in the milled channels of the CP-3 cold plate of the TW-7 rectifier, from in-house rig runs: Nu = 0.21 Re^0.62 Pr^(1/3).',
    category: 'internal-flow', situation: 'cold plate channel', tags: ['in-house', 'cold plate', 'TW-7 cabinet'],
    inputs: [
      { symbol: 'Re_ch', name: 'Reynolds number on the channel hydraulic diameter', unit: '1' },
      { symbol: 'Pr', name: 'Prandtl number of the coolant at its mean temperature', unit: '1' },
    ],
    outputs: [{ symbol: 'Nu_ch', name: 'average Nusselt number on the channel hydraulic diameter', unit: '1', expression: '0.21 * Re_ch^0.62 * Pr^(1/3)' }],
    validity: [{ symbol: 'Re_ch', min: 300, max: 3000, note: 'range of the rig runs' }, { symbol: 'Pr', min: 4, max: 8, note: 'water-glycol 30 % at 10–45 °C' }],
    references: [{ citation: REPORT, locator: 'Table 2' }],
    accuracy: { rel: 0.05, basis: 'rig uncertainty ±5 % (invented demo data)' },
    propertyBasis: 'Coolant properties at the mean of inlet and outlet temperatures.',
    notes: 'In-house fit for the CP-3 plate only; invented demo data. The scanned table is attached to each check case.',
  };
  const checkCases = [
    ...rows.map((r) => ({
      label: r.label, inputs: { Re_ch: r.Re_ch, Pr: r.Pr }, expected: { Nu_ch: r.Nu_ch },
      tolerance: { rel: 0.05, why: 'rig uncertainty ±5 %' },
      source: { kind: 'published', citation: REPORT, locator: `Table 2, ${r.label}`, attachment },
    })),
    { label: 'above the tested range', inputs: { Re_ch: 5000, Pr: 6 }, expected: {}, tolerance: { rel: 1e-9 }, source: { kind: 'common-practice', citation: 'validity range of the rig runs' }, expectWarnings: ['Re_ch'] },
  ];
  await createCorrelation({ actor: author, slug: SLUG, definition, checkCases });
  await submitVersion({ actor: author, slug: SLUG, version: 1 });
  await decideVersion({ actor: approver, slug: SLUG, version: 1, decision: 'approve', comment: 'Fit agrees with Table 2 of the attached report within the rig uncertainty.', password: DEMO_PASSWORD,
    waiver: 'In-house fit of our own cold plate: the rig runs are the only data there are (one kind of evidence).' });
}

export async function down(): Promise<void> {
  await db().Correlation.destroy({ where: { slug: SLUG } });
}
