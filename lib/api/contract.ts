import { z } from 'zod';
import { CATEGORIES } from '@/lib/engine/types';
import { VERSION_STATUSES } from '@/models/correlation';

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
}).strict().refine((b) => (b.inputs === undefined) !== (b.rows === undefined), { message: 'send either "inputs" or "rows", not both and not neither', path: ['inputs'] });

export const warning = z.object({
  symbol: z.string(), value: z.number(), min: z.number().optional(), max: z.number().optional(), message: z.string(),
});

export const evaluateAnswer = z.object({
  slug: z.string(), version: z.number().int(), contentHash: z.string().nullable(), status: z.enum(VERSION_STATUSES),
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
  })),
  total: z.number().int(), page: z.number().int(), pageSize: z.number().int(),
});

export const correlationAnswer = z.object({
  slug: z.string(), title: z.string(), category: z.string(), situation: z.string(), tags: z.array(z.string()),
  latestApprovedVersion: z.number().int().nullable(),
  versions: z.array(z.object({
    version: z.number().int(), status: z.enum(VERSION_STATUSES), contentHash: z.string().nullable(), author: z.string(),
    approvedAt: z.string().optional(), withdrawnAt: z.string().optional(), withdrawnReason: z.string().nullable().optional(),
  })),
});

export const checkCaseShape = z.object({
  label: z.string(), inputs: z.record(z.string(), inputValue), expected: z.record(z.string(), z.number()),
  tolerance: z.object({ rel: z.number().optional(), abs: z.number().optional(), why: z.string().optional() }),
  source: z.object({ kind: z.enum(['published', 'numerical', 'common-practice', 'memory']), citation: z.string(), locator: z.string().optional() }),
  expectWarnings: z.array(z.string()).optional(), expectRefusal: z.boolean().optional(),
});

export const versionAnswer = z.object({
  slug: z.string(), version: z.number().int(), status: z.enum(VERSION_STATUSES), contentHash: z.string().nullable(),
  definition: z.record(z.string(), z.unknown()).describe('the definition, as validated by the definition JSON Schema'),
  checkCases: z.array(checkCaseShape),
  validation: z.record(z.string(), z.unknown()).nullable().describe('the validation report of the submitted version'),
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
}).strict();
export const withdrawBody = z.object({ reason: z.string().max(2000) }).strict();
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
