import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createServer, type Server } from 'node:http';
import { createHmac } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { call, DEMO_PASSWORD, signIn } from '../support/http';
import { freshUser, plateCases, plateDefinition, FIXTURE_WAIVER } from '../support/fixtures';
import { verifyWebhook } from '@/lib/webhooks/signature';
import { closeSequelize } from '@/lib/db/connection';

/** A receiver on loopback that records every request and answers from a script (500 first, then 200, …). */
interface Received { path: string; headers: Record<string, string>; body: string; at: number }
function receiver() {
  const got: Received[] = [];
  const answers: number[] = [];
  const server: Server = createServer((req, res) => {
    let body = '';
    req.on('data', (c) => { body += c; });
    req.on('end', () => {
      got.push({ path: req.url ?? '', headers: Object.fromEntries(Object.entries(req.headers).map(([k, v]) => [k, String(v)])), body, at: Date.now() });
      res.statusCode = answers.shift() ?? 200;
      res.end('ok');
    });
  });
  return { got, answers, server };
}

async function until<T>(f: () => T | Promise<T>, ms = 20_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await f();
    if (v || Date.now() > end) return v;
    await new Promise((r) => setTimeout(r, 150));
  }
}

describe('webhooks: signed deliveries when a followed version changes, retried, logged and replayable', () => {
  const rx = receiver();
  let base = '';
  let admin = '';
  let approver = '';
  let integrator: Awaited<ReturnType<typeof freshUser>>;
  let other: Awaited<ReturnType<typeof freshUser>>;
  let author: Awaited<ReturnType<typeof freshUser>>;
  const slug = `test-hook-${Date.now()}`;
  let endpoint = 0;
  let secret = '';

  beforeAll(async () => {
    await new Promise<void>((r) => rx.server.listen(0, '127.0.0.1', () => r()));
    base = `http://127.0.0.1:${(rx.server.address() as AddressInfo).port}`;
    admin = (await signIn('admin@demo.example')).cookie!;
    approver = (await signIn('approver@demo.example')).cookie!;
    integrator = await freshUser(['integrator'], 'hook');
    other = await freshUser(['integrator'], 'hook-other');
    author = await freshUser(['author'], 'hook-author');
    const allow = await call('/api/admin/webhook-allowlist', { cookie: admin, method: 'PUT', body: { prefixes: [`${base}/hooks/`] } });
    expect(allow.status).toBe(200);
  });

  afterAll(async () => {
    rx.server.close();
    await closeSequelize();
  });

  it('refuses a URL that is not on the admin’s allow-list, naming the field, and changes to the list by anyone but an admin', async () => {
    const res = await call('/api/webhooks', { cookie: integrator.cookie, body: { url: 'http://169.254.169.254/latest', events: ['version.approved'] } });
    expect(res.status).toBe(422);
    expect(res.body.error.details.issues[0]).toMatchObject({ path: 'url' });
    const noEvents = await call('/api/webhooks', { cookie: integrator.cookie, body: { url: `${base}/hooks/a`, events: [] } });
    expect(noEvents.status).toBe(422);
    expect(noEvents.body.error.details.issues[0].path).toBe('events');
    expect((await call('/api/admin/webhook-allowlist', { cookie: integrator.cookie, method: 'PUT', body: { prefixes: ['http://evil.example/'] } })).status).toBe(403);
  });

  it('registers an endpoint and shows its secret once', async () => {
    const res = await call('/api/webhooks', { cookie: integrator.cookie, body: { url: `${base}/hooks/library`, events: ['version.approved', 'version.superseded', 'version.withdrawn'], slugs: [slug] } });
    expect(res.status).toBe(200);
    expect(res.body.secret).toMatch(/^whsec_/);
    endpoint = res.body.id;
    secret = res.body.secret;
    const list = await call('/api/webhooks', { cookie: integrator.cookie });
    expect(list.body.items.map((e: { id: number }) => e.id)).toContain(endpoint);
    expect(JSON.stringify(list.body)).not.toContain(secret);
    // Another person's endpoint answers like a missing one.
    expect((await call(`/api/webhooks/${endpoint}/deliveries`, { cookie: other.cookie })).status).toBe(404);
  });

  it('delivers version.approved signed with HMAC-SHA-256 over timestamp and body, retrying after a 500', async () => {
    rx.answers.push(500);
    await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(), checkCases: plateCases() } });
    expect((await call(`/api/correlations/${slug}/versions/1/submit`, { cookie: author.cookie, method: 'POST' })).status).toBe(200);
    const decision = await call(`/api/correlations/${slug}/versions/1/decision`, { cookie: approver, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'Reviewed.', password: DEMO_PASSWORD } });
    expect(decision.status).toBe(200);
    const two = await until(() => rx.got.filter((g) => g.headers['correlary-webhook-event'] === 'version.approved').length >= 2);
    expect(two).toBe(true);
    const [first, retry] = rx.got.filter((g) => g.headers['correlary-webhook-event'] === 'version.approved');
    // Same delivery id on the retry, signed afresh.
    expect(retry.headers['correlary-webhook-id']).toBe(first.headers['correlary-webhook-id']);
    const body = JSON.parse(retry.body);
    expect(body).toMatchObject({ event: 'version.approved', data: { slug, version: 1 } });
    expect(body.data.contentHash).toMatch(/^[0-9a-f]{64}$/);
    // The signature checked independently of the app's code: HMAC-SHA-256 of "<timestamp>.<body>".
    const t = retry.headers['correlary-webhook-timestamp'];
    expect(retry.headers['correlary-webhook-signature']).toBe(`v1=${createHmac('sha256', secret).update(`${t}.${retry.body}`).digest('hex')}`);
    expect(verifyWebhook({ secret, timestamp: t, signature: retry.headers['correlary-webhook-signature'], body: retry.body })).toEqual({ ok: true });
    const log = await until(async () => {
      const d = (await call(`/api/webhooks/${endpoint}/deliveries`, { cookie: integrator.cookie })).body.items.find((i: { event: string }) => i.event === 'version.approved');
      return d?.status === 'delivered' ? d : null;
    });
    expect(log).toMatchObject({ status: 'delivered', attempts: 2, lastStatus: 200 });
  });

  it('a receiver rejects a captured delivery replayed later (stale timestamp) and a tampered body', () => {
    const d = rx.got.find((g) => g.headers['correlary-webhook-event'] === 'version.approved')!;
    const t = Number(d.headers['correlary-webhook-timestamp']);
    const sig = d.headers['correlary-webhook-signature'];
    expect(verifyWebhook({ secret, timestamp: t, signature: sig, body: d.body, now: t + 10 * 60 })).toEqual({ ok: false, reason: 'stale' });
    expect(verifyWebhook({ secret, timestamp: t, signature: sig, body: d.body.replace('"version":1', '"version":9'), now: t })).toEqual({ ok: false, reason: 'mismatch' });
    expect(verifyWebhook({ secret: 'whsec_wrong', timestamp: t, signature: sig, body: d.body, now: t })).toEqual({ ok: false, reason: 'mismatch' });
  });

  it('replays a delivery from the log as a new, freshly signed delivery; pings on request', async () => {
    const items = (await call(`/api/webhooks/${endpoint}/deliveries`, { cookie: integrator.cookie })).body.items;
    const approved = items.find((i: { event: string }) => i.event === 'version.approved');
    const before = rx.got.length;
    const replay = await call(`/api/webhooks/${endpoint}/deliveries/${approved.id}/replay`, { cookie: integrator.cookie, method: 'POST' });
    expect(replay.status).toBe(200);
    expect(replay.body.replayOf).toBe(approved.id);
    expect(await until(() => rx.got.length > before)).toBe(true);
    const again = rx.got[rx.got.length - 1];
    expect(again.headers['correlary-webhook-id']).toBe(String(replay.body.id));
    expect(verifyWebhook({ secret, timestamp: again.headers['correlary-webhook-timestamp'], signature: again.headers['correlary-webhook-signature'], body: again.body })).toEqual({ ok: true });
    const ping = await call(`/api/webhooks/${endpoint}/ping`, { cookie: integrator.cookie, method: 'POST' });
    expect(ping.status).toBe(200);
    expect(await until(() => rx.got.some((g) => g.headers['correlary-webhook-event'] === 'ping'))).toBe(true);
  });

  it('follows the correlations a person’s tokens evaluated: superseded and withdrawn reach both endpoints', async () => {
    // A second endpoint names no slugs: it follows what this person's API tokens evaluate.
    const token = (await call('/api/tokens', { cookie: integrator.cookie, body: { name: 'hook test', scopes: ['read', 'evaluate'] } })).body.token as string;
    expect((await call(`/api/correlations/${slug}/evaluate`, { token, body: { inputs: { Re_x: 1e4, Pr: 0.7 } } })).status).toBe(200);
    const second = await call('/api/webhooks', { cookie: integrator.cookie, body: { url: `${base}/hooks/used`, events: ['version.superseded', 'version.withdrawn'] } });
    expect(second.status).toBe(200);
    // Usage is written within a second; wait for it before the change that must find it.
    await new Promise((r) => setTimeout(r, 1500));
    expect((await call(`/api/correlations/${slug}/versions`, { cookie: author.cookie, body: {} })).status).toBe(200);
    await call(`/api/correlations/${slug}/versions/2`, { cookie: author.cookie, method: 'PATCH', body: { definition: plateDefinition(0.333), checkCases: plateCases(0.333) } });
    expect((await call(`/api/correlations/${slug}/versions/2/submit`, { cookie: author.cookie, method: 'POST' })).status).toBe(200);
    expect((await call(`/api/correlations/${slug}/versions/2/decision`, { cookie: approver, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'Reviewed.', password: DEMO_PASSWORD } })).status).toBe(200);
    expect((await call(`/api/correlations/${slug}/versions/2/withdraw`, { cookie: approver, body: { reason: 'Coefficient not traceable to the source.', password: DEMO_PASSWORD } })).status).toBe(200);
    const byPath = (path: string, event: string) => rx.got.filter((g) => g.path === path && g.headers['correlary-webhook-event'] === event);
    expect(await until(() => rx.got.filter((g) => g.headers['correlary-webhook-event'] === 'version.withdrawn').length >= 2)).toBe(true);
    expect(byPath('/hooks/library', 'version.superseded')).toHaveLength(1);
    expect(byPath('/hooks/used', 'version.superseded')).toHaveLength(1);
    expect(byPath('/hooks/library', 'version.withdrawn')).toHaveLength(1);
    expect(byPath('/hooks/used', 'version.withdrawn')).toHaveLength(1);
    const withdrawn = JSON.parse(rx.got.find((g) => g.headers['correlary-webhook-event'] === 'version.withdrawn')!.body);
    expect(withdrawn.data).toMatchObject({ slug, version: 2, reason: 'Coefficient not traceable to the source.' });
  });

  it('stops deliveries to a deleted endpoint', async () => {
    expect((await call(`/api/webhooks/${endpoint}`, { cookie: integrator.cookie, method: 'DELETE' })).status).toBe(200);
    expect((await call(`/api/webhooks/${endpoint}/deliveries`, { cookie: integrator.cookie })).status).toBe(404);
  });
});
