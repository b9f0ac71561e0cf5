import 'server-only';
import { NextResponse, type NextRequest } from 'next/server';
import { getServerSession } from 'next-auth';
import { z, type ZodType } from 'zod';
import { isConcurrentChange, isDatabaseUnavailable } from '@/lib/db/errors';
import { authOptions } from '@/lib/auth/options';
import { findUserById, type AuthUser } from '@/lib/auth/users';
import { resolveApiToken, type TokenScope } from '@/lib/api/tokens';
import { AppError, statusOf } from './errors';
import { ACCESS, type AccessRule, type RouteKey } from './access';

export interface Caller {
  user: AuthUser;
  via: 'session' | 'token';
  tokenId: number | null;
  scopes: TokenScope[] | null;
}

interface Spec<Q, B, P> {
  query?: ZodType<Q>;
  body?: ZodType<B>;
  params?: ZodType<P>;
  /** Largest accepted body, bytes. */
  maxBody?: number;
}

export interface Ctx<Q, B, P> {
  req: NextRequest;
  caller: Caller | null;
  query: Q;
  body: B;
  params: P;
}

type Handler<Q, B, P> = (ctx: Ctx<Q, B, P>) => Promise<Response | unknown>;

export function zodIssues(error: z.ZodError) {
  return error.issues.map((i) => ({ path: i.path.join('.') || '(body)', message: i.message }));
}

function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    const status = statusOf(err.code);
    const body = { error: { code: err.code, message: err.message, ...(err.details !== undefined ? { details: err.details } : {}) } };
    return NextResponse.json(body, { status: status === 500 ? 400 : status, headers: { 'cache-control': 'no-store', ...err.headers } });
  }
  // A unique index caught a race the service's own check could not see (two requests at once).
  if (err instanceof Error && err.name === 'SequelizeUniqueConstraintError') {
    return NextResponse.json({ error: { code: 'conflict:duplicate', message: 'Someone else just created the same thing; reload and try again.' } }, { status: 409 });
  }
  // A simultaneous change won (deadlock, lock wait, a Galera certification conflict): nothing was kept; retry.
  if (isConcurrentChange(err)) {
    return NextResponse.json({ error: { code: 'unavailable:concurrent-change', message: 'A simultaneous change to the same records came first; nothing of this request was kept. Retry it.' } }, { status: 503, headers: { 'Retry-After': '1', 'cache-control': 'no-store' } });
  }
  // The database is down or unreachable: say so, and let the client retry; the pool reconnects by itself.
  if (isDatabaseUnavailable(err)) {
    console.error('database unavailable:', (err as Error).message);
    return NextResponse.json({ error: { code: 'unavailable:database', message: 'The database is not reachable just now; nothing was changed. Retry in a few seconds.' } }, { status: 503, headers: { 'Retry-After': '5', 'cache-control': 'no-store' } });
  }
  console.error('unhandled error in route handler', err);
  return NextResponse.json({ error: { code: 'internal', message: 'Something went wrong on the server; the error was logged.' } }, { status: 500 });
}

async function identify(req: NextRequest): Promise<Caller | null> {
  const header = req.headers.get('authorization');
  if (header) {
    const match = /^Bearer\s+(\S+)$/i.exec(header);
    if (!match) throw new AppError('unauthenticated:header', 'The Authorization header must be "Bearer <token>".');
    const token = await resolveApiToken(match[1]);
    return { user: token.user, via: 'token', tokenId: token.id, scopes: token.scopes };
  }
  const session = await getServerSession(authOptions);
  if (!session?.user?.id) return null;
  // Roles are read fresh from the database: a role change or deactivation takes effect at once.
  const user = await findUserById({ id: session.user.id });
  // A session issued before a password change, sign-out, deactivation or role change is over.
  if (!user || !user.isActive || user.sessionVersion !== (session.user.sv ?? 0)) return null;
  return { user: { id: user.id, email: user.email, name: user.name, roles: user.roleNames(), session: { via: session.user.via ?? 'password', authAt: session.user.authAt ?? 0 } }, via: 'session', tokenId: null, scopes: null };
}

export function authorize(caller: Caller | null, access: AccessRule): asserts caller is Caller {
  if (!caller) throw new AppError('unauthenticated:required', 'Sign in or send an API token (Authorization: Bearer …).');
  if (caller.via === 'token') {
    if (!access.scope) throw new AppError('forbidden:person-only', 'This action is for a person signed in to Correlary; API tokens cannot do it.');
    if (!caller.scopes?.includes(access.scope)) throw new AppError('forbidden:token-scope', `The API token lacks the "${access.scope}" scope.`);
  }
  if (access.roles && !access.roles.some((r) => caller.user.roles.includes(r))) {
    throw new AppError('forbidden:role', `This needs one of the roles: ${access.roles.join(', ')}.`);
  }
}

async function readBody(req: NextRequest, maxBody: number): Promise<unknown> {
  const declared = Number(req.headers.get('content-length') ?? 0);
  if (declared > maxBody) throw new AppError('too_large:body', `The request body is larger than ${maxBody} bytes.`);
  const text = await req.text();
  if (text.length > maxBody) throw new AppError('too_large:body', `The request body is larger than ${maxBody} bytes.`);
  if (!text.trim()) throw new AppError('bad_request:body', 'The request body is empty; send a JSON object.');
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError('bad_request:json', 'The request body is not valid JSON.');
  }
}

/** Field problems listed in one error answer; beyond that only their count (an answer never outgrows its question). */
export const MAX_LISTED_ISSUES = 50;

function parseWith<T>(schema: ZodType<T>, value: unknown, what: string): T {
  const result = schema.safeParse(value);
  if (!result.success) {
    const all = zodIssues(result.error);
    const issues = all.slice(0, MAX_LISTED_ISSUES).map((i) => ({ path: i.path.slice(0, 200), message: i.message.slice(0, 300) }));
    const shown = issues.slice(0, 5).map((i) => `${i.path}: ${i.message}`).join('; ');
    throw new AppError(`invalid:${what}`, `The ${what} is not valid: ${shown}${all.length > 5 ? ` (and ${all.length - 5} more)` : ''}`, { issues, count: all.length });
  }
  return result.data;
}

const SAFE_METHODS = ['GET', 'HEAD', 'OPTIONS'];

/**
 * Cross-site request forgery: a state-changing request made with a session cookie must come from
 * the app's own pages — same Origin (or Referer) — and, when it carries a body, as JSON (a plain
 * HTML form or a text/plain fetch from another site can do neither). Token requests carry no
 * ambient credentials and are exempt.
 */
function assertSameOrigin(req: NextRequest, hasBody: boolean) {
  if (SAFE_METHODS.includes(req.method)) return;
  const allowed = new Set([req.nextUrl.origin]);
  if (process.env.NEXTAUTH_URL) { try { allowed.add(new URL(process.env.NEXTAUTH_URL).origin); } catch { /* a malformed setting allows nothing more */ } }
  const origin = req.headers.get('origin') ?? (() => { try { return new URL(req.headers.get('referer') ?? '').origin; } catch { return null; } })();
  if (!origin || !allowed.has(origin)) throw new AppError('forbidden:cross-origin', 'This request did not come from Correlary\'s own pages; signed-in changes are accepted from the app itself only.');
  if (hasBody && !/^application\/json\b/i.test(req.headers.get('content-type') ?? '')) {
    throw new AppError('bad_request:content-type', 'Send the body as JSON (Content-Type: application/json).');
  }
}

/**
 * One wrapper for every handler: parse → authenticate → authorize → act → respond. Who may call the
 * route is its row in the access table (lib/http/access.ts), named by `key` ("POST /api/…").
 */
export function route<Q = undefined, B = undefined, P = undefined>(key: RouteKey, spec: Spec<Q, B, P>, handler: Handler<Q, B, P>) {
  const access: AccessRule = ACCESS[key];
  return async (req: NextRequest, context: { params: Promise<Record<string, string>> }) => {
    const started = performance.now();
    const answer = await handle(req, context);
    // Server-Timing: the handler's own time, for browsers' developer tools and the benchmark (npm run bench:api).
    try { answer.headers.set('server-timing', `app;dur=${(performance.now() - started).toFixed(2)}`); } catch { /* immutable headers (a redirect): no timing */ }
    return answer;
  };

  async function handle(req: NextRequest, context: { params: Promise<Record<string, string>> }): Promise<Response> {
    try {
      const caller = await identify(req);
      authorize(caller, access);
      if (caller.via === 'session') assertSameOrigin(req, Boolean(spec.body));
      const params = spec.params ? parseWith(spec.params, await context.params, 'path') : (undefined as P);
      const query = spec.query
        ? parseWith(spec.query, Object.fromEntries(req.nextUrl.searchParams.entries()), 'query')
        : (undefined as Q);
      const body = spec.body ? parseWith(spec.body, await readBody(req, spec.maxBody ?? 1_000_000), 'body') : (undefined as B);
      const result = await handler({ req, caller, query, body, params });
      // Answers carry the caller's data (tokens, users, drafts): no shared cache keeps them unless a route says so.
      if (result instanceof Response) {
        if (!result.headers.has('cache-control')) result.headers.set('cache-control', 'no-store');
        return result;
      }
      return NextResponse.json(result, { headers: { 'cache-control': 'no-store' } });
    } catch (err) {
      return errorResponse(err);
    }
  }
}
