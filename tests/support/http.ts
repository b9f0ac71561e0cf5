// HTTP helpers for integration tests against the running test server (scripts/test.sh starts it).
export const BASE = process.env.TEST_BASE_URL ?? 'http://127.0.0.1:3100';
export const DEMO_PASSWORD = 'correlary-demo-2026';

export interface Answer<T = any> {
  status: number;
  body: T;
  headers: Headers;
}

export async function call<T = any>(path: string, init: { method?: string; body?: unknown; rawBody?: string; token?: string; cookie?: string; headers?: Record<string, string> } = {}): Promise<Answer<T>> {
  const headers: Record<string, string> = { ...init.headers };
  if (init.token) headers.authorization = `Bearer ${init.token}`;
  // A browser sends its page's Origin with every state-changing request; tests with a session do too.
  if (init.cookie) { headers.cookie = init.cookie; headers.origin ??= BASE; }
  if (init.body !== undefined || init.rawBody !== undefined) headers['content-type'] = 'application/json';
  const res = await fetch(BASE + path, {
    method: init.method ?? (init.body !== undefined || init.rawBody !== undefined ? 'POST' : 'GET'),
    headers,
    body: init.rawBody ?? (init.body !== undefined ? JSON.stringify(init.body) : undefined),
    redirect: 'manual',
  });
  const text = await res.text();
  let body: unknown = text;
  try { body = text ? JSON.parse(text) : null; } catch { /* not JSON */ }
  return { status: res.status, body: body as T, headers: res.headers };
}

function cookiesOf(res: Response): string[] {
  return res.headers.getSetCookie().map((c) => c.split(';')[0]);
}

/** Signs in through next-auth's credentials flow; returns the session cookie header, or the error. */
export async function signIn(email: string, password = DEMO_PASSWORD, headers: Record<string, string> = {}): Promise<{ cookie?: string; error?: string }> {
  const csrfRes = await fetch(`${BASE}/api/auth/csrf`);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const jar = cookiesOf(csrfRes);
  const res = await fetch(`${BASE}/api/auth/callback/credentials`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: jar.join('; '), 'x-auth-return-redirect': '1', ...headers },
    body: new URLSearchParams({ csrfToken, email, password, json: 'true', callbackUrl: `${BASE}/library` }),
    redirect: 'manual',
  });
  const set = cookiesOf(res);
  const session = set.find((c) => c.startsWith('next-auth.session-token='));
  if (session) return { cookie: [...jar, session].join('; ') };
  const data = (await res.json().catch(() => ({}))) as { url?: string };
  const error = data.url ? new URL(data.url).searchParams.get('error') ?? 'unknown' : `status ${res.status}`;
  return { error };
}
