import type { Role } from '@/models';
import type { TokenScope } from '@/lib/api/tokens';

export interface AccessRule {
  /** Any one of these roles is enough; omit for "any signed-in user". */
  roles?: Role[];
  /**
   * The scope a token must carry to call this route. A route without one is for people only: every
   * token is refused (deny by default), so sign-off, withdrawal, token minting, passwords, project
   * membership and user administration can never be done by a script.
   */
  scope?: TokenScope;
}

/**
 * Who may call what: every route × method of the HTTP API, in one table a reviewer can read.
 * `route(key, …)` in lib/http/handler.ts takes its rule from here, and
 * tests/integration/access-matrix.test.ts fails for a route file without a row (or a row without
 * a route), then probes every row with anonymous callers, each role's session and tokens of each
 * role with each scope set, revoked, expired and deactivated.
 * Services check ownership and four-eyes again on top (only the author edits a draft, never approve your own…).
 */
export const ACCESS = {
  // Library and versions: anyone signed in, tokens with "read".
  'GET /api/correlations': { scope: 'read' },
  'GET /api/correlations/{slug}': { scope: 'read' },
  'GET /api/correlations/{slug}/versions/{n}': { scope: 'read' },
  'GET /api/correlations/{slug}/versions/{n}/deviation': { scope: 'read' },
  'GET /api/templates': { scope: 'read' },
  'POST /api/compare': { scope: 'read' },
  'GET /api/advice': { scope: 'read' },
  // Evaluating and running: "evaluate" (counted by the rate limit).
  'POST /api/correlations/{slug}/evaluate': { scope: 'evaluate' },
  'POST /api/templates/{slug}/run': { scope: 'evaluate' },
  'POST /api/advice': { scope: 'evaluate' },
  'POST /api/calculations/{id}/rerun': { scope: 'evaluate' },
  // Authoring: authors; tokens with "write".
  'POST /api/correlations': { roles: ['author'], scope: 'write' },
  'POST /api/attachments': { roles: ['author'], scope: 'write' },
  'GET /api/attachments/{id}': { scope: 'read' },
  'POST /api/correlations/{slug}/versions': { roles: ['author'], scope: 'write' },
  'PATCH /api/correlations/{slug}/versions/{n}': { roles: ['author'], scope: 'write' },
  'POST /api/correlations/{slug}/versions/{n}/submit': { roles: ['author'], scope: 'write' },
  'POST /api/correlations/{slug}/versions/{n}/validate': { roles: ['author', 'approver'], scope: 'write' },
  'GET /api/my-work': { roles: ['author'] },
  // Review and sign-off: approvers, in person.
  'GET /api/review-queue': { roles: ['approver'] },
  'POST /api/correlations/{slug}/versions/{n}/comments': { roles: ['author', 'approver'] },
  'POST /api/correlations/{slug}/versions/{n}/decision': { roles: ['approver'] },
  'POST /api/correlations/{slug}/versions/{n}/withdraw': { roles: ['approver'] },
  'GET /api/correlations/{slug}/versions/{n}/uses': { roles: ['approver', 'admin'] },
  // Projects and calculations: reads with "read", saving with "write"; project membership in person.
  'GET /api/projects': { scope: 'read' },
  'POST /api/projects': { roles: ['engineer'], scope: 'write' },
  'GET /api/projects/{id}': { scope: 'read' },
  'POST /api/projects/{id}/members': {},
  'GET /api/calculations': { scope: 'read' },
  'POST /api/calculations': { scope: 'write' },
  'GET /api/calculations/{id}': { scope: 'read' },
  'GET /api/calculations/{id}/csv': { scope: 'read' },
  // The caller's own account and tokens: in person only.
  'POST /api/account/password': {},
  'DELETE /api/account/sessions': {},
  'GET /api/tokens': {},
  'POST /api/tokens': {},
  'DELETE /api/tokens/{id}': {},
  // Webhooks: each person's own endpoints (admins see all); tokens with "write" may manage them.
  'GET /api/webhooks': { scope: 'write' },
  'POST /api/webhooks': { scope: 'write' },
  'DELETE /api/webhooks/{id}': { scope: 'write' },
  'GET /api/webhooks/{id}/deliveries': { scope: 'write' },
  'POST /api/webhooks/{id}/deliveries/{deliveryId}/replay': { scope: 'write' },
  'POST /api/webhooks/{id}/ping': { scope: 'write' },
  // Administration: admins, in person.
  'GET /api/admin/webhook-allowlist': { roles: ['admin'] },
  'PUT /api/admin/webhook-allowlist': { roles: ['admin'] },
  'GET /api/admin/users': { roles: ['admin'] },
  'POST /api/admin/users': { roles: ['admin'] },
  'PATCH /api/admin/users/{id}': { roles: ['admin'] },
  'GET /api/admin/audit': { roles: ['admin'] },
  'GET /api/admin/mail': { roles: ['admin'] },
  'GET /api/admin/evidence-policy': { scope: 'read' },
  'PUT /api/admin/evidence-policy': { roles: ['admin'] },
  'GET /api/admin/sign-in': { roles: ['admin'] },
  'PUT /api/admin/sign-in': { roles: ['admin'] },
} as const satisfies Record<string, AccessRule>;

export type RouteKey = keyof typeof ACCESS;

/** Route handlers outside the wrapper, on purpose: public, holding no data, or next-auth's own. */
export const OUTSIDE_THE_WRAPPER = {
  'GET /api/health': 'public liveness and readiness, no data',
  'GET /api/openapi.json': 'public API description, no data',
  'GET /api/clients/correlary.py': 'public Python client source, no data',
  'GET /api/auth/{...nextauth}': "next-auth's sign-in endpoints (their own CSRF token)",
  'POST /api/auth/{...nextauth}': "next-auth's sign-in endpoints (their own CSRF token)",
} as const;
