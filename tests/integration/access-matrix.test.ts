import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { call, signIn } from '../support/http';
import { freshUser } from '../support/fixtures';
import { db, type Role } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { createApiToken, revokeApiToken, TOKEN_SCOPES, type TokenScope } from '@/lib/api/tokens';
import { ACCESS, OUTSIDE_THE_WRAPPER, type AccessRule } from '@/lib/http/access';

/** Every `export const METHOD = …` of every app/api route file, as "METHOD /api/path/{param}". */
function declaredRoutes(): { key: string; viaWrapper: boolean }[] {
  const out: { key: string; viaWrapper: boolean }[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const p = join(dir, name);
      if (statSync(p).isDirectory()) { walk(p); continue; }
      if (name !== 'route.ts') continue;
      const path = `/${relative('app', dir)}`.replace(/\[([^\]]+)\]/g, '{$1}');
      const text = readFileSync(p, 'utf8');
      for (const m of text.matchAll(/export (?:const|async function|function) (GET|POST|PATCH|PUT|DELETE)\b(.*)/g)) {
        const wrapped = /=\s*route\('([^']+)'/.exec(m[2]);
        if (wrapped) expect(wrapped[1], `${p}: ${m[1]} names its own row`).toBe(`${m[1]} ${path}`);
        out.push({ key: `${m[1]} ${path}`, viaWrapper: Boolean(wrapped) });
      }
      for (const m of text.matchAll(/export \{ handler as (GET|POST) , handler as (GET|POST) \}|export \{ handler as (GET|POST), handler as (GET|POST) \}/g)) {
        for (const method of m.slice(1).filter(Boolean)) out.push({ key: `${method} ${path}`, viaWrapper: false });
      }
    }
  };
  walk('app/api');
  return out;
}

interface Identity { name: string; cookie?: string; token?: string; roles: Role[]; scopes: TokenScope[] | null; dead: boolean }

describe('the access table covers every route, and every route keeps it', () => {
  const identities: Identity[] = [];
  beforeAll(async () => {
    const { User } = db();
    identities.push({ name: 'anonymous', roles: [], scopes: null, dead: true });
    const scopeSets: TokenScope[][] = [['read'], ['evaluate'], ['write'], [...TOKEN_SCOPES]];
    for (const who of ['admin', 'author', 'approver', 'engineer', 'integrator']) {
      const email = `${who}@demo.example`;
      const user = await User.findOne({ where: { email }, include: ['roles'] });
      const roles = user!.roleNames();
      identities.push({ name: `${who} session`, cookie: (await signIn(email)).cookie!, roles, scopes: null, dead: false });
      for (const scopes of scopeSets) {
        const { token } = await createApiToken({ actorId: null, userId: user!.id, name: `matrix ${scopes.join('+')}`, scopes, expiresAt: null });
        identities.push({ name: `${who} token [${scopes.join(' ')}]`, token, roles, scopes, dead: false });
      }
    }
    const integrator = (await User.findOne({ where: { email: 'integrator@demo.example' } }))!.id;
    const revoked = await createApiToken({ actorId: null, userId: integrator, name: 'matrix revoked', scopes: [...TOKEN_SCOPES], expiresAt: null });
    await revokeApiToken({ actorId: integrator, tokenId: revoked.id, isAdmin: true });
    identities.push({ name: 'revoked token', token: revoked.token, roles: ['integrator'], scopes: [...TOKEN_SCOPES], dead: true });
    const expired = await createApiToken({ actorId: null, userId: integrator, name: 'matrix expired', scopes: [...TOKEN_SCOPES], expiresAt: new Date(Date.now() - 1000) });
    identities.push({ name: 'expired token', token: expired.token, roles: ['integrator'], scopes: [...TOKEN_SCOPES], dead: true });
    const gone = await freshUser(['admin', 'author', 'approver', 'engineer'], 'matrix-deactivated');
    const goneToken = await createApiToken({ actorId: null, userId: gone.user.id, name: 'matrix deactivated', scopes: [...TOKEN_SCOPES], expiresAt: null });
    await User.update({ isActive: false }, { where: { id: gone.user.id } });
    identities.push({ name: 'deactivated user session', cookie: gone.cookie, roles: [], scopes: null, dead: true });
    identities.push({ name: 'deactivated user token', token: goneToken.token, roles: [], scopes: [...TOKEN_SCOPES], dead: true });
  });
  afterAll(() => closeSequelize());

  it('has exactly one row for every route file and method (a new route without a row fails here)', () => {
    const declared = declaredRoutes();
    const wrapped = declared.filter((d) => d.viaWrapper).map((d) => d.key).sort();
    const outside = declared.filter((d) => !d.viaWrapper).map((d) => d.key).sort();
    expect(wrapped).toEqual(Object.keys(ACCESS).sort());
    expect(outside).toEqual(Object.keys(OUTSIDE_THE_WRAPPER).sort());
  });

  it('answers every route × identity as the table says: 401, 403, or through to the route', async () => {
    const expectation = (rule: AccessRule, id: Identity): 401 | 403 | 'through' => {
      if (id.dead) return 401;
      if (id.token) {
        if (!rule.scope || !id.scopes!.includes(rule.scope)) return 403;
      }
      if (rule.roles && !rule.roles.some((r) => id.roles.includes(r))) return 403;
      return 'through';
    };
    let probes = 0;
    const wrong: string[] = [];
    // Ending one's sessions really happens when let through: probe it last, after every other row.
    const last = 'DELETE /api/account/sessions';
    const rows = (Object.entries(ACCESS) as [string, AccessRule][]).sort(([a], [b]) => Number(a === last) - Number(b === last));
    for (const [key, rule] of rows) {
      const [method, template] = key.split(' ');
      // Ids that exist nowhere and empty bodies: a caller let through meets 404 or 422 and changes nothing.
      const path = template.replace('{slug}', 'no-such-entry').replace('{n}', '999999').replace('{id}', '999999999');
      const body = method === 'GET' || method === 'DELETE' ? undefined : {};
      for (const id of identities) {
        const res = await call(path, { method, body, cookie: id.cookie, token: id.token });
        const want = expectation(rule, id);
        probes++;
        const ok = want === 'through' ? res.status !== 401 && res.status !== 403 && res.status < 500 : res.status === want;
        if (!ok) wrong.push(`${key} as ${id.name}: expected ${want}, got ${res.status} ${JSON.stringify(res.body).slice(0, 120)}`);
      }
    }
    expect(wrong).toEqual([]);
    expect(probes).toBeGreaterThan(900);
  });
});
