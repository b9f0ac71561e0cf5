import { z } from 'zod';
import { CATEGORIES, SOURCE_KINDS } from '@/lib/engine/types';
import { GRADES } from '@/lib/engine/evidence';
import { VERSION_STATUSES } from '@/models/correlation';
import { WEBHOOK_EVENTS } from '@/lib/webhooks/events';

/**
 * The HTTP API contract (see ../shared/PRODUCT.md): the zod schemas the route handlers parse with,
 * and from which /api/openapi.json is generated. Change them here, compatibly.
 */

export const slugParam = z.string().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'must be a correlation slug such as "cylinder-crossflow-churchill-bernstein"').max(100);
export const versionParam = z.coerce.number().int('must be a whole number').positive('must be 1 or more');

export const correlationPath = z.object({ slug: slugParam });
export const versionPath = z.object({ slug: slugParam, n: versionParam });

export const listQuery = z.object({
  q: z.string().max(100).optional(),
  category: z.enum(CATEGORIES).optional(),
  situation: z.string().max(120).optional(),
  grade: z.enum(GRADES).optional().describe('evidence grade of the approved version'),
  status: z.enum([...VERSION_STATUSES, 'any']).optional(),
  sort: z.enum(['title', 'category', 'updated', 'slug']).optional(),
  dir: z.enum(['asc', 'desc']).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200, 'at most 200').default(50),
}).strict();

export const inputValue = z.union([
  z.number().describe('value in the input\'s declared unit'),
  z.object({ value: z.number(), unit: z.string().min(1).max(60) }).describe('value with its unit, e.g. { "value": 40, "unit": "degC" }'),
]);

export const evaluateBody = z.object({
  version: z.number().int().positive().optional().describe('pin this version; default: the latest approved version'),
  inputs: z.record(z.string(), z.unknown()).optional().describe('one set of inputs: symbol → number or { value, unit }'),
  rows: z.array(z.unknown()).optional().describe('a batch: up to 10,000 input sets, answered in order'),
  outputUnits: z.record(z.string().max(40), z.string().min(1).max(60)).optional()
    .refine((u) => !u || Object.keys(u).length <= 20, { message: 'at most 20 outputs' })
    .describe('answer these outputs in these units instead of the declared ones: symbol → unit, e.g. { "h": "BTU/(hr ft^2 degF)" }'),
}).strict().refine((b) => (b.inputs === undefined) !== (b.rows === undefined), { message: 'send either "inputs" or "rows", not both and not neither', path: ['inputs'] });

export const warning = z.object({
  symbol: z.string(), value: z.number(), min: z.number().optional(), max: z.number().optional(), message: z.string(),
});

export const band = z.object({
  rel: z.number().describe('± relative: the stated accuracy of the correlation on its data (0 for an exact solution of its model)'),
  basis: z.string().describe('where the figure comes from'),
  approximates: z.string().optional().describe('set when rel is the deviation from this other correlation'),
}).describe('accuracy band of an output; not a guarantee: the published accuracy on the data the correlation was fitted to');

export const evaluateAnswer = z.object({
  slug: z.string(), version: z.number().int(), contentHash: z.string().nullable(), status: z.enum(VERSION_STATUSES),
  bands: z.record(z.string(), band.nullable()).describe('band of each output (null: the version states no accuracy); the same for every row'),
  units: z.record(z.string(), z.string()).describe('the unit each output is given in: the declared one, or the one asked for in outputUnits ("1": dimensionless)'),
  outputs: z.record(z.string(), z.number()).optional(),
  warnings: z.array(warning).optional(),
  results: z.array(z.object({
    outputs: z.record(z.string(), z.number()).nullable(), warnings: z.array(warning),
    error: z.object({ code: z.string(), message: z.string() }).optional(),
  })).optional(),
});

export const listAnswer = z.object({
  items: z.array(z.object({
    slug: z.string(), title: z.string(), category: z.string(), situation: z.string(), tags: z.array(z.string()),
    latestApprovedVersion: z.number().int().nullable(), latestVersion: z.number().int(), latestStatus: z.enum(VERSION_STATUSES),
    validity: z.string(), approvedAt: z.string().nullable(), updatedAt: z.string(),
    evidenceGrade: z.enum(GRADES).nullable().describe('evidence grade of the approved version (lib/engine/evidence.ts)'),
  })),
  total: z.number().int(), page: z.number().int(), pageSize: z.number().int(),
});

export const correlationAnswer = z.object({
  slug: z.string(), title: z.string(), category: z.string(), situation: z.string(), tags: z.array(z.string()),
  latestApprovedVersion: z.number().int().nullable(),
  versions: z.array(z.object({
    version: z.number().int(), status: z.enum(VERSION_STATUSES), contentHash: z.string().nullable(), evidenceGrade: z.enum(GRADES).nullable(), author: z.string(),
    approvedAt: z.string().optional(), withdrawnAt: z.string().optional(), withdrawnReason: z.string().nullable().optional(),
  })),
});

export const checkCaseShape = z.object({
  label: z.string(), inputs: z.record(z.string(), inputValue), expected: z.record(z.string(), z.number()),
  tolerance: z.object({ rel: z.number().optional(), abs: z.number().optional(), why: z.string().optional() }),
  source: z.object({ kind: z.enum(SOURCE_KINDS), citation: z.string(), locator: z.string().optional() }),
  expectWarnings: z.array(z.string()).optional(), expectRefusal: z.boolean().optional(),
});

export const versionAnswer = z.object({
  slug: z.string(), version: z.number().int(), status: z.enum(VERSION_STATUSES), contentHash: z.string().nullable(),
  definition: z.record(z.string(), z.unknown()).describe('the definition, as validated by the definition JSON Schema'),
  checkCases: z.array(checkCaseShape),
  validation: z.record(z.string(), z.unknown()).nullable().describe('the validation report of the submitted version'),
  evidence: z.object({
    grade: z.enum(GRADES), meaning: z.string(), byKind: z.record(z.string(), z.number()), independent: z.number().int(), kinds: z.number().int(),
    published: z.boolean(), coverage: z.number(), toleranceOverAccuracy: z.number().nullable(),
    accuracy: z.object({ rel: z.number(), basis: z.string(), approximates: z.string().optional(), byOutput: z.record(z.string(), z.number()).optional() }).nullable(),
    policy: z.object({ minimumIndependent: z.number().int(), minimumKinds: z.number().int() }), meetsPolicy: z.boolean(),
  }).nullable().describe('what the check cases prove: in-range passing cases by kind, coverage, the grade and the policy'),
});

export const errorAnswer = z.object({
  error: z.object({ code: z.string().describe('kind:subject, e.g. not_found:correlation'), message: z.string(), details: z.unknown().optional() }),
});

// Bodies of the authoring and review endpoints.
const MAX_CHECK_CASES = 1000;
export const createCorrelationBody = z.object({
  slug: z.string().min(1, 'Enter a slug').max(100),
  definition: z.record(z.string(), z.unknown()),
  checkCases: z.array(z.unknown()).max(MAX_CHECK_CASES, `at most ${MAX_CHECK_CASES} check cases`).default([]),
}).strict();
export const updateDraftBody = z.object({
  definition: z.record(z.string(), z.unknown()).optional(),
  checkCases: z.array(z.unknown()).max(MAX_CHECK_CASES, `at most ${MAX_CHECK_CASES} check cases`).optional(),
}).strict();
export const newVersionBody = z.object({ fromVersion: z.number().int().positive().optional() }).strict();
export const decisionBody = z.object({
  decision: z.enum(['approve', 'return']),
  comment: z.string().max(5000).default(''),
  password: z.string().max(128).optional(),
  waiver: z.string().max(2000).optional().describe('why you approve a version whose evidence is below the policy (required then)'),
}).strict();
export const evidencePolicyBody = z.object({
  minimumIndependent: z.number().int().min(0).max(50),
  minimumKinds: z.number().int().min(0).max(8),
}).strict();
export const withdrawBody = z.object({
  reason: z.string().max(2000),
  password: z.string().max(128).optional().describe('your current password: a withdrawal is signed like an approval'),
}).strict();
export const commentBody = z.object({ body: z.string().max(5000) }).strict();
export const compareBody = z.object({
  items: z.array(z.object({ slug: slugParam, version: z.number().int().positive().optional() })).min(1).max(8),
  sweep: z.string().min(1).max(32),
  output: z.string().min(1).max(32),
  fixed: z.record(z.string(), z.number()).default({}),
  from: z.number().optional(),
  to: z.number().optional(),
  points: z.number().int().min(2).max(400).default(80),
}).strict();

// Calculation templates, projects and saved calculations.
export const templatesQuery = z.object({
  q: z.string().max(100).optional(),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200, 'at most 200').default(50),
}).strict();

export const templateListAnswer = z.object({
  items: z.array(z.object({
    slug: z.string(), title: z.string(), category: z.string(), situation: z.string(),
    version: z.number().int().nullable().describe('the latest approved version'), contentHash: z.string().nullable(), status: z.enum(VERSION_STATUSES).nullable(),
  })),
  total: z.number().int(),
});

const pin = z.object({ slug: z.string(), version: z.number().int(), contentHash: z.string() });
export const chainWarning = warning.extend({ step: z.string().describe('key of the step where the warning arose ("inputs", "template" or a step key)') });
export const stepRecord = z.object({
  key: z.string(), title: z.string(), kind: z.enum(['correlation', 'expression']),
  correlation: pin.nullable().describe('the pinned correlation version this step evaluated; null for arithmetic'),
  choice: z.object({ key: z.string(), title: z.string(), rule: z.string(), picked: z.string(), options: z.array(z.string()) }).optional()
    .describe('set when a choice picked this step: the rule and the option picked'),
  inputs: z.record(z.string(), z.number()).describe('what the step took, in the units it takes them'),
  outputs: z.record(z.string(), z.number()), units: z.record(z.string(), z.string()), warnings: z.array(chainWarning),
});

export const runBody = evaluateBody;
export const runAnswer = z.object({
  slug: z.string().nullable(), version: z.number().int().nullable(), contentHash: z.string().nullable(), status: z.enum(VERSION_STATUSES).nullable(), title: z.string(),
  units: z.record(z.string(), z.string()).describe('unit of each output'),
  steps: z.array(stepRecord).optional(), outputs: z.record(z.string(), z.number()).optional(),
  warnings: z.array(chainWarning).optional().describe('every warning of every step, with the step key'),
  uncertainty: z.object({
    method: z.string(),
    outputs: z.record(z.string(), z.object({
      value: z.number(), unit: z.string(),
      rel: z.number().nullable().describe('± relative band of the result (null: no step with a stated accuracy moves it)'),
      complete: z.boolean().describe('false when a step that moves the result states no accuracy'),
      budget: z.array(z.object({
        step: z.string(), title: z.string(), symbol: z.string(), correlation: pin.nullable(),
        rel: z.number().nullable(), basis: z.string().nullable(),
        sensitivity: z.number().describe('∂ln(result)/∂ε of this step output'),
        contribution: z.number().nullable(), share: z.number().nullable().describe('share of the squared band, 0–1'),
      })),
      sensitivities: z.record(z.string(), z.object({ derivative: z.number(), elasticity: z.number(), unit: z.string() })),
    })),
  }).optional().describe('single runs: the band of every result, its budget by step, and the sensitivities to the inputs'),
  results: z.array(z.object({
    outputs: z.record(z.string(), z.number()).nullable(), warnings: z.array(chainWarning),
    picked: z.record(z.string(), z.string().nullable()).describe('choice key → option picked'),
    error: z.object({ code: z.string(), message: z.string() }).optional(),
  })).optional(),
});

export const idParam = z.object({ id: z.coerce.number().int('must be a whole number').positive('must be 1 or more') });
export const createProjectBody = z.object({
  name: z.string().trim().min(2, 'Give the project a name').max(160, 'At most 160 characters'),
  description: z.string().max(2000, 'At most 2,000 characters').default(''),
}).strict();
export const memberBody = z.object({
  email: z.string().trim().email('Enter an e-mail address').max(190),
  role: z.enum(['editor', 'reviewer']).nullable().describe('null removes the member'),
}).strict();

export const saveCalculationBody = z.object({
  project: z.number().int().positive().describe('project id'),
  title: z.string().trim().min(2, 'Give the calculation a title').max(200, 'At most 200 characters'),
  note: z.string().max(500).optional().describe('what changed in this revision'),
  calculation: z.number().int().positive().optional().describe('save as the next revision of this calculation'),
  template: z.object({ slug: slugParam, version: z.number().int().positive().optional() }).strict().optional(),
  chain: z.record(z.string(), z.unknown()).optional().describe('your own chain of steps (the template JSON Schema), instead of a template'),
  inputs: z.record(z.string(), z.unknown()).optional(),
  rows: z.array(z.unknown()).max(10_000, 'at most 10,000 rows').optional(),
}).strict().refine((b) => (b.inputs === undefined) !== (b.rows === undefined), { message: 'send either "inputs" or "rows", not both and not neither', path: ['inputs'] });

export const calculationsQuery = z.object({ project: z.coerce.number().int().positive('must be a project id') }).strict();
export const calculationQuery = z.object({ revision: z.coerce.number().int().positive().optional() }).strict();

// The applicability advisor.
/** How the advisor ranks its candidates (lib/evaluation/advisor.ts). */
export const RANKING_RULE = 'inside every validity range first, then evidence grade (well-founded, adequate, thin), then the narrower stated band, then title';
const finite = z.number().refine(Number.isFinite, 'must be a finite number');
export const adviceBody = z.object({
  situation: z.string().trim().min(1).max(120).optional().describe('as in the library, e.g. "circular tube" (GET /api/advice lists them)'),
  like: slugParam.optional().describe('or: a correlation whose situation to use'),
  inputs: z.record(z.string().max(32), finite).refine((o) => Object.keys(o).length <= 30, 'at most 30 inputs').describe('dimensionless (or declared-unit) inputs by symbol, e.g. { "Re_D": 30000, "Pr": 3 }'),
  output: z.string().max(32).optional().describe('the output to compare; default: the one most of them give'),
  sweep: z.object({
    symbol: z.string().max(32), from: finite, to: finite, points: z.number().int().min(2).max(200).optional(), log: z.boolean().optional(),
  }).strict().refine((s) => s.to > s.from, { message: '"to" must be above "from"', path: ['to'] }).optional().describe('a sweep of one input for a plot (other inputs held)'),
}).strict().refine((b) => b.situation !== undefined || b.like !== undefined, { message: 'give "situation" or "like"', path: ['situation'] });

const adviceBreak = z.object({ symbol: z.string(), value: z.number(), min: z.number().optional(), max: z.number().optional(), factor: z.number().describe('value over the bound it breaks'), message: z.string() });
const spread = z.object({ min: z.number(), max: z.number(), median: z.number(), rel: z.number().describe('(max − min)/median'), count: z.number().int() }).nullable();
export const adviceAnswer = z.object({
  situation: z.string(), output: z.string(), inputs: z.record(z.string(), z.number()), ranking: z.string().describe('the rule the list is ranked by'),
  spread: z.object({ inside: spread.describe('among the correlations whose ranges hold the point'), all: spread.describe('among every one evaluated') }),
  sweep: z.object({ symbol: z.string(), x: z.array(z.number()) }).nullable(),
  candidates: z.array(z.object({
    rank: z.number().int(), slug: z.string(), title: z.string(), version: z.number().int(), contentHash: z.string().nullable(),
    grade: z.enum(GRADES).nullable(), band: band.nullable(), inputs: z.array(z.string()),
    status: z.enum(['inside', 'outside', 'refused', 'needs-inputs', 'other-output']).describe('inside every validity range, outside one or more (value extrapolated), refused by a hard limit, missing inputs, or gives other outputs'),
    note: z.string().optional(), missing: z.array(z.string()).optional(),
    value: z.number().nullable(), breaks: z.array(adviceBreak),
    series: z.array(z.object({ x: z.number(), y: z.number().nullable(), inside: z.boolean() })).nullable(),
  })),
});
export const situationsAnswer = z.object({
  situations: z.array(z.object({ category: z.string(), situation: z.string(), correlations: z.number().int(), inputs: z.array(z.string()), outputs: z.array(z.string()) })),
});

// Webhooks: what an integrator registers and what the delivery log shows.
export const webhookEndpoint = z.object({
  id: z.number().int(), url: z.string(), events: z.array(z.string()), slugs: z.array(z.string()).nullable().describe('followed correlations; null: those your tokens evaluated'),
  createdAt: z.string(), userId: z.number().int(),
  deliveries: z.object({ pending: z.number().int(), delivered: z.number().int(), failed: z.number().int() }),
});
export const webhookListAnswer = z.object({ items: z.array(webhookEndpoint) });
export const registerWebhookAnswer = z.object({
  id: z.number().int(), url: z.string(), events: z.array(z.string()), slugs: z.array(z.string()).nullable(),
  secret: z.string().describe('the signing secret, shown this once; keep it in the receiver'),
});
export const webhookDeliveriesAnswer = z.object({
  items: z.array(z.object({
    id: z.number().int(), event: z.string(), status: z.enum(['pending', 'sending', 'delivered', 'failed']), attempts: z.number().int(),
    nextAttemptAt: z.string().nullable(), lastStatus: z.number().int().nullable(), lastError: z.string().nullable(), deliveredAt: z.string().nullable(),
    createdAt: z.string(), replayOf: z.number().int().nullable(), body: z.unknown(),
  })),
});
export const webhookDeliveryBody = z.object({
  event: z.enum(['version.approved', 'version.superseded', 'version.withdrawn', 'calculation.flagged', 'ping']),
  occurredAt: z.string(),
  data: z.record(z.string(), z.unknown()).describe('version events: slug, version, contentHash (and supersedes, successor or reason); calculation.flagged: calculation, uses, reason'),
});
export const allowlistAnswer = z.object({ prefixes: z.array(z.string()) });


export const registerWebhookBody = z.object({
  url: z.string().trim().min(1, 'Give the URL that receives the deliveries').max(500, 'The URL is too long (500 characters at most)'),
  events: z.array(z.enum(WEBHOOK_EVENTS)).min(1, 'Choose at least one event').max(WEBHOOK_EVENTS.length)
    .refine((e) => new Set(e).size === e.length, 'Each event once'),
  /** The correlations followed, by slug; omitted or empty: those your API tokens have evaluated. */
  slugs: z.array(z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'A slug: lower-case words joined by hyphens').max(80)).max(100, 'At most 100 correlations').optional().nullable(),
}).strict();

export const webhookIdParams = z.object({ id: z.coerce.number().int().positive() });
export const deliveryParams = z.object({ id: z.coerce.number().int().positive(), deliveryId: z.coerce.number().int().positive() });
export const listWebhooksQuery = z.object({ all: z.enum(['1', '0']).optional() });
export const allowlistBody = z.object({
  prefixes: z.array(z.string().trim().min(1, 'An empty prefix').max(300, 'A prefix is too long (300 characters at most)')).max(50, 'At most 50 prefixes'),
}).strict();

/** An evidence document, base64-encoded in JSON (keeps every signed-in change a same-origin JSON request). */
export const attachmentBody = z.object({
  name: z.string().trim().min(1, 'Give the file name').max(300, 'At most 300 characters'),
  content: z.string().min(1, 'The file is empty').max(7_000_000, 'At most 5 MB of document (base64-encoded)').describe('the file\'s bytes, base64-encoded; PDF, PNG or JPEG, detected from the content'),
});
export const attachmentAnswer = z.object({
  id: z.string().uuid(), sha256: z.string().regex(/^[0-9a-f]{64}$/), mediaType: z.enum(['application/pdf', 'image/png', 'image/jpeg']), name: z.string(), size: z.number().int(),
});
export const attachmentParam = z.object({ id: z.string().uuid('must be an evidence document id (a UUID)') });
