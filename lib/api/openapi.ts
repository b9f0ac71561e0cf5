import { z, type ZodType } from 'zod';
import {
  adviceAnswer, adviceBody, situationsAnswer, RANKING_RULE, correlationAnswer, correlationPath, evaluateAnswer, evaluateBody, errorAnswer, listAnswer, listQuery, versionAnswer, versionPath,
  createCorrelationBody, updateDraftBody, decisionBody, withdrawBody, compareBody,
  templatesQuery, templateListAnswer, runBody, runAnswer, idParam, createProjectBody, memberBody, saveCalculationBody,
  calculationsQuery, calculationQuery, webhookListAnswer, registerWebhookAnswer, webhookDeliveriesAnswer, webhookDeliveryBody, allowlistAnswer, allowlistBody, deliveryParams, listWebhooksQuery, registerWebhookBody, webhookIdParams,
  attachmentBody, attachmentAnswer, attachmentParam,
} from './contract';
import { EXAMPLES } from './openapi-examples';

import { ENGINE_VERSION } from '@/lib/engine/validate';

/** JSON Schema (2020-12, as OpenAPI 3.1 uses) of a zod schema, as a request or a response. */
function schema(s: ZodType, io: 'input' | 'output' = 'output') {
  const json = z.toJSONSchema(s, { target: 'draft-2020-12', io, unrepresentable: 'any' }) as Record<string, unknown>;
  delete json.$schema;
  return json;
}

const PARAMETER_TEXT: Record<string, string> = {
  slug: 'the correlation or template slug, e.g. pipe-turbulent-gnielinski', n: 'the version number', id: 'the record number', deliveryId: 'the delivery number',
  q: 'words to find in titles, tags and approved definitions', category: 'only this category', situation: 'only this situation', status: 'only versions in this state (any: all)',
  sort: 'sort by', dir: 'ascending or descending', page: 'page number, from 1', pageSize: 'items per page, at most 200', project: 'the project number',
  revision: 'a revision number; default the latest', all: '1: every record (admins only)',
};

function params(s: z.ZodObject, where: 'path' | 'query') {
  return Object.entries(s.shape).map(([name, field]) => {
    const f = field as ZodType;
    const optional = f.safeParse(undefined).success;
    const described = (schema(f, 'input') as { description?: string }).description;
    return { name, in: where, required: where === 'path' || !optional, description: described ?? PARAMETER_TEXT[name] ?? `the ${name}`, schema: schema(f, 'input') };
  });
}

const deprecationHeaders = {
  Deprecation: { description: 'Set when the pinned version is superseded or withdrawn: since when, as @epoch-seconds (RFC 9745)', schema: { type: 'string' } },
  Link: { description: 'With Deprecation: <…/versions/n>; rel="successor-version", the approved version, when there is one', schema: { type: 'string' } },
};
const errors = (...codes: number[]) => Object.fromEntries(codes.map((c) => [String(c), { $ref: `#/components/responses/E${c}` }]));
const json = (s: ZodType, io: 'input' | 'output' = 'output', example?: unknown) => ({
  content: { 'application/json': { schema: schema(s, io), ...(example !== undefined ? { examples: { example: { summary: 'An example', value: example } } } : {}) } },
});

const TAGS = [
  { name: 'Administration', description: 'Settings an admin keeps: the webhook allow-list.' },
  { name: 'Advice', description: 'Which correlations apply at a point, ranked, with their spread.' },
  { name: 'Calculations', description: 'Saved, frozen calculation records and their exports.' },
  { name: 'Correlations', description: 'The governed library: correlations, their versions, definitions and evidence.' },
  { name: 'Evaluation', description: 'Evaluate approved, pinned versions with range warnings and accuracy bands.' },
  { name: 'Health', description: 'Liveness and readiness of the service.' },
  { name: 'Projects', description: 'Projects that group calculations, with their members.' },
  { name: 'Review', description: 'Authoring, validation, four-eyes sign-off and withdrawal.' },
  { name: 'Templates', description: 'Calculation templates: governed chains of correlations.' },
  { name: 'Webhooks', description: 'Signed notifications when a followed version is approved, superseded or withdrawn, or a calculation is flagged.' },
];

interface Op {
  id: string; tag: string; summary: string; description: string;
  params?: unknown[]; body?: { schema: ZodType; example?: unknown; examples?: Record<string, unknown> };
  ok: { description: string; schema?: ZodType; example?: unknown; headers?: Record<string, unknown>; content?: Record<string, unknown> };
  fail: number[]; extra?: Record<string, unknown>; security?: unknown[];
}
function op(o: Op) {
  const body = o.body ? {
    requestBody: {
      required: true,
      content: { 'application/json': { schema: schema(o.body.schema, 'input'), examples: Object.fromEntries(Object.entries(o.body.examples ?? { example: o.body.example }).map(([k, v]) => [k, { summary: k === 'example' ? 'An example' : k, value: v }])) } },
    },
  } : {};
  const okContent = o.ok.content ?? (o.ok.schema ? json(o.ok.schema, 'output', o.ok.example).content : undefined);
  return {
    operationId: o.id, tags: [o.tag], summary: o.summary, description: o.description,
    ...(o.params?.length ? { parameters: o.params } : {}), ...body, ...(o.security ? { security: o.security } : {}),
    responses: { 200: { description: o.ok.description, ...(o.ok.headers ? { headers: o.ok.headers } : {}), ...(okContent ? { content: okContent } : {}) }, ...(o.extra ?? {}), ...errors(...o.fail) },
  };
}
const ack = z.object({}).passthrough();

/** The OpenAPI 3.1 document of Correlary's HTTP API, generated from the zod schemas the handlers use. */
export function openApiDocument(serverUrl: string) {
  const describedErrors: Record<number, string> = {
    400: 'Malformed request (not JSON, empty body)', 401: 'No valid session or API token', 403: 'Authenticated but not allowed (role or token scope)',
    404: 'Unknown correlation or version, or not visible to the caller', 409: 'Conflicting state (frozen, already decided, integrity alarm)',
    413: 'Body or batch too large', 422: 'Body, query or inputs failed validation; details.issues names each field', 429: 'Rate limit reached; see Retry-After',
    503: 'Busy or a backing service (database, evaluation pool, document store) unreachable; see Retry-After',
  };
  const vp = params(versionPath, 'path');
  const cp = params(correlationPath, 'path');
  const ip = params(idParam, 'path');
  const wp = params(webhookIdParams, 'path');
  const deliveryHeaders = {
    'Correlary-Webhook-Id': 'the delivery number, the same on retries of one delivery',
    'Correlary-Webhook-Event': 'the event name',
    'Correlary-Webhook-Timestamp': 'Unix seconds when this attempt was sent',
    'Correlary-Webhook-Signature': 'v1=<hex HMAC-SHA-256 of "<timestamp>.<raw body>" with the endpoint secret>',
  };
  const delivery = (event: string, what: string) => ({
    post: {
      operationId: `webhook${event.split('.').map((w) => w[0].toUpperCase() + w.slice(1)).join('')}`, tags: ['Webhooks'], summary: `Delivery: ${event}`,
      description: `Correlary posts this to a registered endpoint ${what}. Verify the signature over the raw body, refuse timestamps more than 300 s from your clock, and ignore a Correlary-Webhook-Id you have already processed. Answer 2xx within 5 s; anything else is retried with exponential back-off (at most 8 attempts).`,
      parameters: Object.entries(deliveryHeaders).map(([name, description]) => ({ name, in: 'header', required: true, description, schema: { type: 'string' } })),
      requestBody: { required: true, content: { 'application/json': { schema: schema(webhookDeliveryBody), examples: { example: { summary: 'An example', value: { ...EXAMPLES.webhookDelivery, event } } } } } },
      responses: { 200: { description: 'Received (any 2xx)' }, 401: { description: 'The receiver refuses a bad signature or a stale timestamp (it is retried, then shown as failed)' } },
    },
  });
  return {
    openapi: '3.1.0',
    info: {
      title: 'Correlary API', version: '1.0.0',
      description: `Governed library of thermal and fluids correlations. Evaluate approved, pinned versions; every answer names the version and content hash used. Engine ${ENGINE_VERSION}. Results are engineering estimates within the stated validity ranges, to be checked under the applicable codes and by a responsible licensed engineer.`,
      contact: { name: 'Correlary methods group', url: `${serverUrl}/api-reference`, email: 'methods-group@brightwater.example' },
      license: { name: 'Proprietary: for use inside the operating company', url: `${serverUrl}/api-reference` },
    },
    servers: [{ url: serverUrl, description: 'This installation' }],
    tags: TAGS,
    security: [{ bearer: [] }, { session: [] }],
    components: {
      securitySchemes: {
        bearer: { type: 'http', scheme: 'bearer', description: 'Personal API token (scopes read, evaluate, write), created on the Account page or with npm run token. Routes for people only (sign-off, withdrawal, tokens, users, project membership) refuse every token.' },
        session: { type: 'apiKey', in: 'cookie', name: 'next-auth.session-token', description: 'Browser session' },
      },
      schemas: { Error: { ...schema(errorAnswer), examples: [EXAMPLES.error] } },
      responses: Object.fromEntries(Object.entries(describedErrors).map(([code, description]) => [`E${code}`, { description, content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } }])),
    },
    paths: {
      '/api/attachments': {
        post: op({ id: 'uploadAttachment', tag: 'Review', summary: 'Upload an evidence document', description: 'Authors only (token scope write). A PDF excerpt or a scan of a table page behind a check case: the type is detected from the content (PDF, PNG, JPEG), at most 5 MB, sent base64-encoded in JSON. Name the answer as a check case source\'s attachment; its SHA-256 becomes part of the version\'s content hash.', body: { schema: attachmentBody, example: { name: 'rig-table-3.pdf', content: 'JVBERi0xLjQK…' } }, ok: { description: 'Stored', schema: attachmentAnswer, example: { id: '6f1c2b1e-3d0a-4c55-9a55-2f8f4f5d7e21', sha256: 'a'.repeat(64), mediaType: 'application/pdf', name: 'rig-table-3.pdf', size: 48213 } }, fail: [400, 401, 403, 413, 422, 503] }),
      },
      '/api/attachments/{id}': {
        get: op({ id: 'getAttachment', tag: 'Correlations', summary: 'An evidence document', description: 'For those who may read a version whose check cases name it (and its uploader). The stored bytes are re-hashed before they are served; a mismatch raises the integrity alarm and answers 409.', params: params(attachmentParam, 'path'), ok: { description: 'The document', content: { 'application/pdf': { schema: { type: 'string', format: 'binary' } }, 'image/png': { schema: { type: 'string', format: 'binary' } }, 'image/jpeg': { schema: { type: 'string', format: 'binary' } } } }, fail: [401, 403, 404, 409, 422, 503] }),
      },
      '/api/correlations': {
        get: op({ id: 'listCorrelations', tag: 'Correlations', summary: 'List correlations', description: 'Pages of the library, filtered by words, category, situation, evidence grade and status; sorted by title, category, date or slug. Drafts and versions in review only show to their authors and approvers.', params: params(listQuery, 'query'), ok: { description: 'A page of correlations', schema: listAnswer, example: EXAMPLES.listAnswer }, fail: [401, 403, 422, 429] }),
        post: op({ id: 'createCorrelation', tag: 'Review', summary: 'Create a correlation with its first draft', description: 'Authors only (token scope write). The definition and check cases are stored as draft version 1; nothing is validated until submission.', body: { schema: createCorrelationBody, example: { slug: 'my-correlation', definition: EXAMPLES.versionAnswer.definition, checkCases: [] } }, ok: { description: 'Created', schema: ack, example: { slug: 'my-correlation', version: 1 } }, fail: [400, 401, 403, 409, 413, 422] }),
      },
      '/api/correlations/{slug}': {
        get: op({ id: 'getCorrelation', tag: 'Correlations', summary: 'One correlation and the versions the caller may see', description: 'Versions with status, content hash and evidence grade; drafts and versions in review only for their author and approvers.', params: cp, ok: { description: 'The correlation', schema: correlationAnswer, example: EXAMPLES.correlationAnswer }, fail: [401, 403, 404] }),
      },
      '/api/correlations/{slug}/versions/{n}': {
        get: op({ id: 'getVersion', tag: 'Correlations', summary: 'One version: definition, check cases, validation report, evidence', description: 'Frozen versions carry an ETag and answer 304 to a matching If-None-Match.', params: vp, ok: { description: 'The version', headers: { ETag: { description: 'content hash of a frozen version', schema: { type: 'string' } } }, schema: versionAnswer, example: EXAMPLES.versionAnswer }, extra: { 304: { description: 'Not modified' } }, fail: [401, 403, 404, 409] }),
        patch: op({ id: 'updateDraft', tag: 'Review', summary: 'Change a draft', description: 'Only the draft’s author; submitted versions are frozen.', params: vp, body: { schema: updateDraftBody, example: { definition: EXAMPLES.versionAnswer.definition } }, ok: { description: 'Saved', schema: ack, example: { slug: 'my-correlation', version: 1 } }, fail: [400, 401, 403, 404, 409, 422] }),
      },
      '/api/correlations/{slug}/versions/{n}/submit': { post: op({ id: 'submitVersion', tag: 'Review', summary: 'Validate and submit a draft for review', description: 'Runs the validation (schema, expressions, symbols, dimensions, check cases, coverage, evidence) and freezes the version under its content hash when it passes.', params: vp, ok: { description: 'In review', schema: ack, example: { slug: 'my-correlation', version: 1, status: 'in_review' } }, fail: [401, 403, 404, 409, 422] }) },
      '/api/correlations/{slug}/versions/{n}/decision': { post: op({ id: 'decideVersion', tag: 'Review', summary: 'Approve or return a version', description: 'Approvers in person (no token). Approval needs the current password and never the approver’s own version; below the evidence policy it needs a waiver.', params: vp, body: { schema: decisionBody, example: { decision: 'approve', comment: 'Definition, references and check cases reviewed.', password: 'your-password' } }, ok: { description: 'Decision recorded', schema: ack, example: { slug: 'my-correlation', version: 1, status: 'approved', superseded: null } }, fail: [401, 403, 404, 409, 422] }) },
      '/api/correlations/{slug}/versions/{n}/withdraw': { post: op({ id: 'withdrawVersion', tag: 'Review', summary: 'Withdraw an approved version with a reason', description: 'Approvers in person, with their current password (a withdrawal is signed like an approval). The version stays readable but is never served as latest; everyone who used it is told by e-mail and webhook, and calculations that used it are flagged.', params: vp, body: { schema: withdrawBody, example: { reason: 'Coefficient not traceable to the source.', password: 'your-password' } }, ok: { description: 'Withdrawn; users notified', schema: ack, example: { slug: 'my-correlation', version: 1, status: 'withdrawn', notified: [] } }, fail: [401, 403, 404, 409, 422] }) },
      '/api/correlations/{slug}/versions/{n}/uses': { get: op({ id: 'versionUses', tag: 'Review', summary: 'What uses a version', description: 'Calculations, templates and evaluations by person that used the version; approvers and admins, before a withdrawal.', params: vp, ok: { description: 'Uses', schema: ack, example: { calculations: [], templates: [], evaluations: [] } }, fail: [401, 403, 404] }) },
      '/api/correlations/{slug}/evaluate': {
        post: op({
          id: 'evaluate', tag: 'Evaluation', summary: 'Evaluate a correlation (single inputs or a batch of rows)',
          description: 'Default: the latest approved version; pin one with "version". An input is a number in the declared unit or { value, unit }. Out-of-range inputs are computed and warned about (or refused where a limit is hard). A pinned version that is superseded or withdrawn answers with a warning and Deprecation / Link headers.',
          params: cp, body: { schema: evaluateBody, examples: { example: EXAMPLES.evaluateBody, rows: EXAMPLES.evaluateRowsBody } },
          ok: { description: 'Outputs with range warnings, accuracy bands, version and content hash', headers: deprecationHeaders, schema: evaluateAnswer, example: EXAMPLES.evaluateAnswer }, fail: [400, 401, 403, 404, 409, 413, 422, 429, 503],
        }),
      },
      '/api/compare': { post: op({ id: 'compare', tag: 'Evaluation', summary: 'Evaluate several correlations over a range of one input', description: 'Series of one output against one input for up to eight correlations, with the largest difference where both are valid.', body: { schema: compareBody, example: { items: [{ slug: 'pipe-turbulent-gnielinski' }, { slug: 'pipe-turbulent-petukhov' }], sweep: 'Re_D', output: 'Nu_D', fixed: { Pr: 3 }, from: 10000, to: 100000, points: 40 } }, ok: { description: 'Series and largest differences', schema: ack, example: { series: [] } }, fail: [401, 403, 404, 422] }) },
      '/api/advice': {
        get: op({ id: 'listSituations', tag: 'Advice', summary: 'Situations with approved correlations', description: 'Each situation with the inputs its correlations take and the outputs they give.', ok: { description: 'Situations', schema: situationsAnswer, example: EXAMPLES.situationsAnswer }, fail: [401, 403] }),
        post: op({ id: 'advise', tag: 'Advice', summary: 'Every approved correlation for a situation at one point', description: `Validity, value, band and evidence grade of each, the spread, ranked; optionally a sweep of one input. Ranking rule: ${RANKING_RULE}.`, body: { schema: adviceBody, example: EXAMPLES.adviceBody }, ok: { description: 'Ranked candidates', schema: adviceAnswer, example: EXAMPLES.adviceAnswer }, fail: [400, 401, 403, 404, 422, 429, 503] }),
      },
      '/api/templates': {
        get: op({ id: 'listTemplates', tag: 'Templates', summary: 'Calculation templates with their latest approved version', description: 'Templates chain pinned correlation versions into whole calculations.', params: params(templatesQuery, 'query'), ok: { description: 'Templates', schema: templateListAnswer, example: EXAMPLES.templatesAnswer }, fail: [401, 403, 422] }),
      },
      '/api/templates/{slug}/run': {
        post: op({
          id: 'runTemplate', tag: 'Templates', summary: 'Run a calculation template', description: 'One input set with every step, its warnings at the step and the uncertainty budget, or a batch of rows.',
          params: cp, body: { schema: runBody, example: EXAMPLES.runBody },
          ok: { description: 'Every step (single) or every row (batch) with range warnings at their step, the template version and hash', headers: deprecationHeaders, schema: runAnswer, example: EXAMPLES.runAnswer }, fail: [400, 401, 403, 404, 409, 413, 422, 429, 503],
        }),
      },
      '/api/projects': {
        get: op({ id: 'listProjects', tag: 'Projects', summary: 'Projects the caller may read', description: 'Projects where the caller is a member; approvers and admins read every project.', ok: { description: 'Projects', schema: ack, example: { items: [] } }, fail: [401, 403] }),
        post: op({ id: 'createProject', tag: 'Projects', summary: 'Create a project', description: 'Engineers; the creator owns it.', body: { schema: createProjectBody, example: { name: 'Cabinet cooling', description: 'Door fans and heat sinks' } }, ok: { description: 'Created', schema: ack, example: { id: 3 } }, fail: [401, 403, 422] }),
      },
      '/api/projects/{id}': { get: op({ id: 'getProject', tag: 'Projects', summary: 'A project with its members and calculations', description: 'Calculations carry flags when a version they used was withdrawn.', params: ip, ok: { description: 'The project', schema: ack, example: { id: 3, name: 'Cabinet cooling' } }, fail: [401, 403, 404] }) },
      '/api/projects/{id}/members': { post: op({ id: 'setProjectMember', tag: 'Projects', summary: 'Add, change or remove a member', description: 'The owner or an admin, in person.', params: ip, body: { schema: memberBody, example: { email: 'engineer@demo.example', role: 'editor' } }, ok: { description: 'Members updated', schema: ack, example: { members: [] } }, fail: [401, 403, 404, 422] }) },
      '/api/calculations': {
        get: op({ id: 'listCalculations', tag: 'Calculations', summary: 'Calculations of a project', description: 'Latest revision of each, with flags.', params: params(calculationsQuery, 'query'), ok: { description: 'Calculations', schema: ack, example: { items: [] } }, fail: [401, 403, 404, 422] }),
        post: op({ id: 'saveCalculation', tag: 'Calculations', summary: 'Run and save a calculation or its next revision', description: 'The server runs it and freezes inputs, every intermediate value, versions and hashes under one content hash.', body: { schema: saveCalculationBody, example: { project: 3, title: 'Door panel at 35 °C', template: { slug: 'flat-plate-forced-convection-air' }, inputs: EXAMPLES.runBody.inputs } }, ok: { description: 'Saved: id, revision, content hash', schema: ack, example: { id: 12, revision: 1, contentHash: EXAMPLES.evaluateAnswer.contentHash } }, fail: [400, 401, 403, 404, 409, 413, 422, 429] }),
      },
      '/api/calculations/{id}': { get: op({ id: 'getCalculation', tag: 'Calculations', summary: 'A saved calculation revision', description: 'Integrity-checked against its content hash on every read, with flags and history.', params: [...ip, ...params(calculationQuery, 'query')], ok: { description: 'The calculation', schema: ack, example: { id: 12, revision: 1 } }, fail: [401, 403, 404, 409] }) },
      '/api/calculations/{id}/rerun': { post: op({ id: 'rerunCalculation', tag: 'Calculations', summary: 'Re-run against the latest approved versions', description: 'Compares step by step; nothing is saved.', params: [...ip, ...params(calculationQuery, 'query')], ok: { description: 'Changes by step', schema: ack, example: { steps: [] } }, fail: [401, 403, 404, 409, 422, 429] }) },
      '/api/calculations/{id}/csv': { get: op({ id: 'calculationCsv', tag: 'Calculations', summary: 'CSV export of a saved revision', description: 'Inputs, results and every step as comma-separated values.', params: [...ip, ...params(calculationQuery, 'query')], ok: { description: 'CSV', content: { 'text/csv': { schema: { type: 'string' }, examples: { example: { summary: 'An example', value: 'symbol,value,unit\nh,9.3,W/(m^2 K)\n' } } } } }, fail: [401, 403, 404, 409] }) },
      '/api/webhooks': {
        get: op({ id: 'listWebhooks', tag: 'Webhooks', summary: 'Your webhook endpoints', description: 'Endpoints with their delivery counts; never their secrets. Token scope write.', params: params(listWebhooksQuery, 'query'), ok: { description: 'Endpoints', schema: webhookListAnswer, example: { items: [{ ...EXAMPLES.registerWebhookAnswer, secret: undefined, createdAt: '2026-12-01T10:00:00.000Z', userId: 5, deliveries: { pending: 0, delivered: 3, failed: 0 } }] } }, fail: [401, 403, 422] }),
        post: op({ id: 'registerWebhook', tag: 'Webhooks', summary: 'Register a webhook endpoint', description: 'The URL must lie under a prefix on the admin’s allow-list. Name the correlations to follow, or none to follow those your API tokens evaluate. The signing secret is answered this once.', body: { schema: registerWebhookBody, example: EXAMPLES.registerWebhookBody }, ok: { description: 'Registered', schema: registerWebhookAnswer, example: EXAMPLES.registerWebhookAnswer }, fail: [401, 403, 409, 422] }),
      },
      '/api/webhooks/{id}': { delete: op({ id: 'deleteWebhook', tag: 'Webhooks', summary: 'Delete a webhook endpoint', description: 'Pending deliveries to it are dropped.', params: wp, ok: { description: 'Deleted', schema: ack, example: { id: 7, deleted: true } }, fail: [401, 403, 404] }) },
      '/api/webhooks/{id}/deliveries': { get: op({ id: 'listWebhookDeliveries', tag: 'Webhooks', summary: 'Delivery log of an endpoint', description: 'The last 100 deliveries: event, status, attempts, the last answer or error, the body sent.', params: wp, ok: { description: 'Deliveries', schema: webhookDeliveriesAnswer, example: { items: [{ id: 41, event: 'version.withdrawn', status: 'delivered', attempts: 2, nextAttemptAt: null, lastStatus: 200, lastError: null, deliveredAt: '2026-12-01T10:00:02.000Z', createdAt: '2026-12-01T10:00:00.000Z', replayOf: null, body: EXAMPLES.webhookDelivery }] } }, fail: [401, 403, 404] }) },
      '/api/webhooks/{id}/deliveries/{deliveryId}/replay': { post: op({ id: 'replayWebhookDelivery', tag: 'Webhooks', summary: 'Send a delivery again', description: 'Queues the same body as a new delivery, signed afresh when it leaves.', params: params(deliveryParams, 'path'), ok: { description: 'Queued', schema: ack, example: { id: 42, replayOf: 41, status: 'pending' } }, fail: [401, 403, 404] }) },
      '/api/webhooks/{id}/ping': { post: op({ id: 'pingWebhook', tag: 'Webhooks', summary: 'Send a test delivery', description: 'A ping event, to check the receiver and its signature check.', params: wp, ok: { description: 'Queued', schema: ack, example: { id: 43, event: 'ping', status: 'pending' } }, fail: [401, 403, 404] }) },
      '/api/admin/webhook-allowlist': {
        get: op({ id: 'getWebhookAllowlist', tag: 'Administration', summary: 'The webhook allow-list', description: 'URL prefixes deliveries may go to; empty means no webhooks. Admins in person.', ok: { description: 'Prefixes', schema: allowlistAnswer, example: EXAMPLES.allowlistBody }, fail: [401, 403] }),
        put: op({ id: 'setWebhookAllowlist', tag: 'Administration', summary: 'Replace the webhook allow-list', description: 'Admins in person; recorded in the audit trail.', body: { schema: allowlistBody, example: EXAMPLES.allowlistBody }, ok: { description: 'Saved', schema: allowlistAnswer, example: EXAMPLES.allowlistBody }, fail: [401, 403, 422] }),
      },
      '/api/health': { get: op({ id: 'health', tag: 'Health', summary: 'Database reachable and no pending migration', description: 'Public; for load balancers and monitors.', security: [], ok: { description: 'Healthy', schema: ack, example: { ok: true, db: 'up', migrations: 'current' } }, extra: { 503: { description: 'Not ready' } }, fail: [] }) },
    },
    webhooks: {
      versionApproved: delivery('version.approved', 'when a version of a correlation it follows is approved (data: slug, version, contentHash, approvedAt, supersedes)'),
      versionSuperseded: delivery('version.superseded', 'when a version it followed is superseded by a newer approved one (data: slug, version, contentHash, successor)'),
      versionWithdrawn: delivery('version.withdrawn', 'when a version it follows is withdrawn (data: slug, version, contentHash, reason, withdrawnAt)'),
      calculationFlagged: delivery('calculation.flagged', 'when a calculation its owner owns or saved used a withdrawn version (data: calculation, uses, reason)'),
    },
  };
}
