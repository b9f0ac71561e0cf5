/**
 * Examples in the API description: bodies and answers as an integrator would send and see them. Each one is parsed
 * by its zod schema in tests/unit/openapi.test.ts, so an example can never drift from the contract it illustrates.
 */
const HASH = '3f6a0c1be52d8f4a9e07c1d2b8a54e6f0d9c3b7a1e2f4d6c8b0a9e7d5c3b1a2f';
const WHEN = '2026-12-01T10:00:00.000Z';

export const EXAMPLES = {
  listAnswer: {
    items: [{
      slug: 'pipe-turbulent-gnielinski', title: 'Turbulent pipe flow, Gnielinski', category: 'internal-flow', situation: 'circular tube', tags: ['turbulent', 'Nusselt'],
      latestApprovedVersion: 1, latestVersion: 1, latestStatus: 'approved', validity: '3000 ≤ Re_D ≤ 5000000; 0.5 ≤ Pr ≤ 2000', approvedAt: WHEN, updatedAt: WHEN, evidenceGrade: 'adequate',
    }],
    total: 1, page: 1, pageSize: 50,
  },
  correlationAnswer: {
    slug: 'pipe-turbulent-gnielinski', title: 'Turbulent pipe flow, Gnielinski', category: 'internal-flow', situation: 'circular tube', tags: ['turbulent'],
    latestApprovedVersion: 2,
    versions: [
      { version: 1, status: 'superseded', contentHash: HASH, evidenceGrade: 'adequate', author: 'Tomas Varga', approvedAt: WHEN },
      { version: 2, status: 'approved', contentHash: HASH, evidenceGrade: 'well-founded', author: 'Tomas Varga', approvedAt: WHEN },
    ],
  },
  versionAnswer: {
    slug: 'friction-factor-laminar', version: 1, status: 'approved', contentHash: HASH,
    definition: { schemaVersion: 1, title: 'Laminar pipe friction (Hagen–Poiseuille)', inputs: [{ symbol: 'Re_D', name: 'Reynolds number', unit: '1' }], outputs: [{ symbol: 'f', name: 'Darcy friction factor', unit: '1', expression: '64 / Re_D' }] },
    checkCases: [{
      label: 'independent (poiseuille-fd-friction) at Re_D = 1000', inputs: { Re_D: 1000 }, expected: { f: 0.0640000018 },
      tolerance: { rel: 0.0001, why: 'second-order discretization error about 1e-6' },
      source: { kind: 'independent-solution', citation: 'Finite-difference solution of the axial momentum equation', locator: 'validation/reference/formulas.ts#poiseuille-fd-friction' },
    }],
    validation: { passed: true },
    evidence: {
      grade: 'adequate', meaning: 'meets the approval policy minimum of independent checks', byKind: { 'independent-solution': 3, 'cross-check': 1 }, independent: 4, kinds: 2,
      published: false, coverage: 0.667, toleranceOverAccuracy: null, accuracy: { rel: 0, basis: 'exact solution of its model' },
      policy: { minimumIndependent: 3, minimumKinds: 2 }, meetsPolicy: true,
    },
  },
  evaluateBody: { version: 1, inputs: { Re_D: 30000, Pr: { value: 4.3, unit: '1' } } },
  evaluateRowsBody: { rows: [{ Re_D: 10000, Pr: 0.7 }, { Re_D: 100000, Pr: 7 }] },
  evaluateAnswer: {
    slug: 'pipe-turbulent-gnielinski', version: 1, contentHash: HASH, status: 'approved',
    bands: { Nu_D: { rel: 0.1, basis: 'Gnielinski (1976): about ±10 % on the data' } },
    units: { Nu_D: '1' }, outputs: { Nu_D: 170.4 }, warnings: [],
  },
  error: { error: { code: 'invalid:inputs', message: 'The inputs are not valid.', details: { issues: [{ path: 'inputs.Re_D', message: 'must be a finite number' }] } } },
  templatesAnswer: { items: [{ slug: 'flat-plate-forced-convection-air', title: 'Flat plate in air, forced convection', category: 'external-flow', situation: 'flat plate', version: 1, contentHash: HASH, status: 'approved' }], total: 1 },
  runBody: { inputs: { T_inf: { value: 20, unit: 'degC' }, T_s: { value: 60, unit: 'degC' }, p: { value: 1, unit: 'atm' }, u_inf: 3, L: 0.5, W: 0.3 } },
  runAnswer: {
    slug: 'flat-plate-forced-convection-air', version: 1, contentHash: HASH, status: 'approved', title: 'Flat plate in air, forced convection',
    units: { h: 'W/(m^2 K)', q: 'W' }, outputs: { h: 9.3, q: 55.8 }, warnings: [],
    steps: [{ key: 'reynolds', title: 'Reynolds number on the plate length', kind: 'expression', correlation: null, inputs: { u_inf: 3, L: 0.5, nu: 1.7e-5 }, outputs: { Re_L: 88235 }, units: { Re_L: '1' }, warnings: [] }],
  },
  situationsAnswer: { situations: [{ category: 'internal-flow', situation: 'circular tube', correlations: 6, inputs: ['Re_D', 'Pr'], outputs: ['Nu_D'] }] },
  adviceBody: { situation: 'circular tube', inputs: { Re_D: 30000, Pr: 3 }, output: 'Nu_D' },
  adviceAnswer: {
    situation: 'circular tube', output: 'Nu_D', inputs: { Re_D: 30000, Pr: 3 }, ranking: 'inside every validity range first, then evidence grade, then the narrower stated band, then title',
    spread: { inside: { min: 140.2, max: 165.9, median: 151.0, rel: 0.17, count: 4 }, all: { min: 140.2, max: 165.9, median: 151.0, rel: 0.17, count: 4 } },
    sweep: null,
    candidates: [{ rank: 1, slug: 'pipe-turbulent-gnielinski', title: 'Turbulent pipe flow, Gnielinski', version: 1, contentHash: HASH, grade: 'adequate', band: { rel: 0.1, basis: 'about ±10 % on the data' }, inputs: ['Re_D', 'Pr'], status: 'inside', value: 151.0, breaks: [], series: null }],
  },
  registerWebhookBody: { url: 'https://hooks.example.com/correlary', events: ['version.approved', 'version.withdrawn'], slugs: ['pipe-turbulent-gnielinski'] },
  registerWebhookAnswer: { id: 7, url: 'https://hooks.example.com/correlary', events: ['version.approved', 'version.withdrawn'], slugs: ['pipe-turbulent-gnielinski'], secret: 'whsec_ExampleOnlyNotARealSecret012345' },
  allowlistBody: { prefixes: ['https://hooks.example.com/'] },
  webhookDelivery: { event: 'version.withdrawn', occurredAt: WHEN, data: { slug: 'pipe-turbulent-gnielinski', version: 2, contentHash: HASH, reason: 'Coefficient not traceable to the source.', withdrawnAt: WHEN } },
} as const;
