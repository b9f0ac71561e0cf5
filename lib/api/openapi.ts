import { z, type ZodType } from 'zod';
import {
  adviceAnswer, adviceBody, situationsAnswer, RANKING_RULE, correlationAnswer, correlationPath, evaluateAnswer, evaluateBody, errorAnswer, listAnswer, listQuery, versionAnswer, versionPath,
  createCorrelationBody, updateDraftBody, decisionBody, withdrawBody, compareBody,
  templatesQuery, templateListAnswer, runBody, runAnswer, idParam, createProjectBody, memberBody, saveCalculationBody,
  calculationsQuery, calculationQuery,
} from './contract';
import { ENGINE_VERSION } from '@/lib/engine/validate';

/** JSON Schema (2020-12, as OpenAPI 3.1 uses) of a zod schema, as a request or a response. */
function schema(s: ZodType, io: 'input' | 'output' = 'output') {
  const json = z.toJSONSchema(s, { target: 'draft-2020-12', io, unrepresentable: 'any' }) as Record<string, unknown>;
  delete json.$schema;
  return json;
}

function params(s: z.ZodObject, where: 'path' | 'query') {
  return Object.entries(s.shape).map(([name, field]) => {
    const f = field as ZodType;
    const optional = f.safeParse(undefined).success;
    return { name, in: where, required: where === 'path' || !optional, schema: schema(f, 'input') };
  });
}

const deprecationHeaders = {
  Deprecation: { description: 'Set when the pinned version is superseded or withdrawn: since when, as @epoch-seconds (RFC 9745)', schema: { type: 'string' } },
  Link: { description: 'With Deprecation: <…/versions/n>; rel="successor-version", the approved version, when there is one', schema: { type: 'string' } },
};
const errors = (...codes: number[]) => Object.fromEntries(codes.map((c) => [String(c), { $ref: `#/components/responses/E${c}` }]));
const json = (s: ZodType, io: 'input' | 'output' = 'output') => ({ content: { 'application/json': { schema: schema(s, io) } } });

/** The OpenAPI 3.1 document of Correlary's HTTP API, generated from the zod schemas the handlers use. */
export function openApiDocument(serverUrl: string) {
  const describedErrors: Record<number, string> = {
    400: 'Malformed request (not JSON, empty body)', 401: 'No valid session or API token', 403: 'Authenticated but not allowed (role or token scope)',
    404: 'Unknown correlation or version, or not visible to the caller', 409: 'Conflicting state (frozen, already decided, integrity alarm)',
    413: 'Body or batch too large', 422: 'Body, query or inputs failed validation; details.issues names each field', 429: 'Rate limit reached; see Retry-After',
    503: 'The evaluation pool is busy; see Retry-After',
  };
  return {
    openapi: '3.1.0',
    info: {
      title: 'Correlary API', version: '1.0.0',
      description: `Governed library of thermal and fluids correlations. Evaluate approved, pinned versions; every answer names the version and content hash used. Engine ${ENGINE_VERSION}. Results are engineering estimates within the stated validity ranges, to be checked under the applicable codes and by a responsible licensed engineer.`,
    },
    servers: [{ url: serverUrl }],
    security: [{ bearer: [] }, { session: [] }],
    components: {
      securitySchemes: {
        bearer: { type: 'http', scheme: 'bearer', description: 'Personal API token (scopes read, evaluate, write), created on the Account page or with npm run token. Routes for people only (sign-off, withdrawal, tokens, users, project membership) refuse every token.' },
        session: { type: 'apiKey', in: 'cookie', name: 'next-auth.session-token', description: 'Browser session' },
      },
      schemas: { Error: schema(errorAnswer) },
      responses: Object.fromEntries(Object.entries(describedErrors).map(([code, description]) => [`E${code}`, { description, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } }])),
    },
    paths: {
      '/api/correlations': {
        get: { operationId: 'listCorrelations', summary: 'List correlations', parameters: params(listQuery, 'query'), responses: { 200: { description: 'A page of correlations', ...json(listAnswer) }, ...errors(401, 403, 422, 429) } },
        post: { operationId: 'createCorrelation', summary: 'Create a correlation with its first draft (authors)', requestBody: { required: true, ...json(createCorrelationBody, 'input') }, responses: { 200: { description: 'Created' }, ...errors(400, 401, 403, 409, 413, 422) } },
      },
      '/api/correlations/{slug}': {
        get: { operationId: 'getCorrelation', summary: 'One correlation and the versions the caller may see', parameters: params(correlationPath, 'path'), responses: { 200: { description: 'The correlation', ...json(correlationAnswer) }, ...errors(401, 403, 404) } },
      },
      '/api/correlations/{slug}/versions/{n}': {
        get: {
          operationId: 'getVersion', summary: 'One version: definition, check cases, validation report', parameters: params(versionPath, 'path'),
          responses: { 200: { description: 'The version; frozen versions carry an ETag and honour If-None-Match', headers: { ETag: { schema: { type: 'string' } } }, ...json(versionAnswer) }, 304: { description: 'Not modified' }, ...errors(401, 403, 404, 409) },
        },
        patch: { operationId: 'updateDraft', summary: 'Change a draft (its author)', parameters: params(versionPath, 'path'), requestBody: { required: true, ...json(updateDraftBody, 'input') }, responses: { 200: { description: 'Saved' }, ...errors(400, 401, 403, 404, 409, 422) } },
      },
      '/api/correlations/{slug}/versions/{n}/submit': { post: { operationId: 'submitVersion', summary: 'Validate and submit a draft for review', parameters: params(versionPath, 'path'), responses: { 200: { description: 'In review' }, ...errors(401, 403, 404, 409, 422) } } },
      '/api/correlations/{slug}/versions/{n}/decision': { post: { operationId: 'decideVersion', summary: 'Approve (with password) or return a version (approvers, browser session)', parameters: params(versionPath, 'path'), requestBody: { required: true, ...json(decisionBody, 'input') }, responses: { 200: { description: 'Decision recorded' }, ...errors(401, 403, 404, 409, 422) } } },
      '/api/correlations/{slug}/versions/{n}/withdraw': { post: { operationId: 'withdrawVersion', summary: 'Withdraw an approved version with a reason', parameters: params(versionPath, 'path'), requestBody: { required: true, ...json(withdrawBody, 'input') }, responses: { 200: { description: 'Withdrawn; users notified' }, ...errors(401, 403, 404, 409, 422) } } },
      '/api/correlations/{slug}/evaluate': {
        post: {
          operationId: 'evaluate', summary: 'Evaluate a correlation (single inputs or a batch of rows)', parameters: params(correlationPath, 'path'),
          requestBody: { required: true, ...json(evaluateBody, 'input') },
          responses: { 200: { description: 'Outputs with range warnings, version and content hash. A pinned version that is superseded or withdrawn answers with a warning in the body and the headers below.', headers: deprecationHeaders, ...json(evaluateAnswer) }, ...errors(400, 401, 403, 404, 409, 413, 422, 429, 503) },
        },
      },
      '/api/compare': { post: { operationId: 'compare', summary: 'Evaluate several correlations over a range of one input', requestBody: { required: true, ...json(compareBody, 'input') }, responses: { 200: { description: 'Series and largest differences' }, ...errors(401, 403, 404, 422) } } },
      '/api/templates': {
        get: { operationId: 'listTemplates', summary: 'Calculation templates with their latest approved version', parameters: params(templatesQuery, 'query'), responses: { 200: { description: 'Templates', ...json(templateListAnswer) }, ...errors(401, 403, 422) } },
      },
      '/api/advice': {
        get: { operationId: 'listSituations', summary: 'Situations with approved correlations, with the inputs they take and the outputs they give', responses: { 200: { description: 'Situations', ...json(situationsAnswer) }, ...errors(401, 403) } },
        post: {
          operationId: 'advise', summary: 'Every approved correlation for a situation at one point: validity, value, band, evidence grade, spread, ranked; optionally a sweep of one input',
          requestBody: { required: true, ...json(adviceBody, 'input') },
          responses: { 200: { description: `Ranked candidates; ranking rule: ${RANKING_RULE}`, ...json(adviceAnswer) }, ...errors(400, 401, 403, 404, 422, 429, 503) },
        },
      },
      '/api/templates/{slug}/run': {
        post: {
          operationId: 'runTemplate', summary: 'Run a calculation template: one input set with every step, or a batch of rows', parameters: params(correlationPath, 'path'),
          requestBody: { required: true, ...json(runBody, 'input') },
          responses: { 200: { description: 'Every step (single) or every row (batch) with range warnings at their step, the template version and hash', headers: deprecationHeaders, ...json(runAnswer) }, ...errors(400, 401, 403, 404, 409, 413, 422, 429, 503) },
        },
      },
      '/api/projects': {
        get: { operationId: 'listProjects', summary: 'Projects the caller may read', responses: { 200: { description: 'Projects' }, ...errors(401, 403) } },
        post: { operationId: 'createProject', summary: 'Create a project (engineers)', requestBody: { required: true, ...json(createProjectBody, 'input') }, responses: { 200: { description: 'Created' }, ...errors(401, 403, 422) } },
      },
      '/api/projects/{id}': { get: { operationId: 'getProject', summary: 'A project with its members and calculations (flags for withdrawn versions)', parameters: params(idParam, 'path'), responses: { 200: { description: 'The project' }, ...errors(401, 403, 404) } } },
      '/api/projects/{id}/members': { post: { operationId: 'setProjectMember', summary: 'Add, change or remove a member (owner or admin, browser session)', parameters: params(idParam, 'path'), requestBody: { required: true, ...json(memberBody, 'input') }, responses: { 200: { description: 'Members updated' }, ...errors(401, 403, 404, 422) } } },
      '/api/calculations': {
        get: { operationId: 'listCalculations', summary: 'Calculations of a project', parameters: params(calculationsQuery, 'query'), responses: { 200: { description: 'Calculations' }, ...errors(401, 403, 404, 422) } },
        post: { operationId: 'saveCalculation', summary: 'Run and save a calculation or its next revision (the server runs it; the record is frozen under a content hash)', requestBody: { required: true, ...json(saveCalculationBody, 'input') }, responses: { 200: { description: 'Saved: id, revision, content hash' }, ...errors(400, 401, 403, 404, 409, 413, 422, 429) } },
      },
      '/api/calculations/{id}': { get: { operationId: 'getCalculation', summary: 'A saved calculation revision (integrity-checked) with flags and history', parameters: [...params(idParam, 'path'), ...params(calculationQuery, 'query')], responses: { 200: { description: 'The calculation' }, ...errors(401, 403, 404, 409) } } },
      '/api/calculations/{id}/rerun': { post: { operationId: 'rerunCalculation', summary: 'Re-run a saved revision against the latest approved versions and compare step by step (nothing saved)', parameters: [...params(idParam, 'path'), ...params(calculationQuery, 'query')], responses: { 200: { description: 'Changes by step' }, ...errors(401, 403, 404, 409, 422, 429) } } },
      '/api/calculations/{id}/csv': { get: { operationId: 'calculationCsv', summary: 'CSV export of a saved revision', parameters: [...params(idParam, 'path'), ...params(calculationQuery, 'query')], responses: { 200: { description: 'CSV', content: { 'text/csv': { schema: { type: 'string' } } } }, ...errors(401, 403, 404, 409) } } },
      '/api/correlations/{slug}/versions/{n}/uses': { get: { operationId: 'versionUses', summary: 'What uses a version: calculations, templates, evaluations by person (approvers, admins)', parameters: params(versionPath, 'path'), responses: { 200: { description: 'Uses' }, ...errors(401, 403, 404) } } },
      '/api/health': { get: { operationId: 'health', summary: 'Database reachable and no pending migration', security: [], responses: { 200: { description: 'Healthy' }, 503: { description: 'Not ready' } } } },
    },
  };
}
