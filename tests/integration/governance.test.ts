import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readdirSync, readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { execFileSync } from 'node:child_process';
import { QueryTypes } from 'sequelize';
import { call, DEMO_PASSWORD, signIn } from '../support/http';
import { freshUser, plateCases, plateDefinition, FIXTURE_WAIVER } from '../support/fixtures';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { verifyAuditChain } from '@/lib/audit/log';

const MAIL_DIR = process.env.MAIL_DIR!;
const mailTo = (email: string) => (existsSync(MAIL_DIR) ? readdirSync(MAIL_DIR) : [])
  .map((f) => JSON.parse(readFileSync(join(MAIL_DIR, f), 'utf8')) as { to: string[]; subject: string; text: string })
  .filter((m) => m.to.includes(email));

async function snapshot(slug: string) {
  const { sequelize } = db();
  const [row] = await sequelize.query<{ versions: number; statuses: string; runs: number; audit: number; cases: number }>(`
    SELECT (SELECT COUNT(*) FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id WHERE c.slug = :slug) AS versions,
      (SELECT GROUP_CONCAT(v.status ORDER BY v.version) FROM correlation_versions v JOIN correlations c ON c.id = v.correlation_id WHERE c.slug = :slug) AS statuses,
      (SELECT COUNT(*) FROM validation_runs r JOIN correlation_versions v ON v.id = r.version_id JOIN correlations c ON c.id = v.correlation_id WHERE c.slug = :slug) AS runs,
      (SELECT COUNT(*) FROM audit_events) AS audit,
      (SELECT COUNT(*) FROM check_cases k JOIN correlation_versions v ON v.id = k.version_id JOIN correlations c ON c.id = v.correlation_id WHERE c.slug = :slug) AS cases`,
  { replacements: { slug }, type: QueryTypes.SELECT });
  return row;
}

describe('governance life cycle over HTTP against MariaDB', () => {
  let author: Awaited<ReturnType<typeof freshUser>>;
  let author2: Awaited<ReturnType<typeof freshUser>>;
  let dual: Awaited<ReturnType<typeof freshUser>>;
  let approver: string;
  let approver2: string;
  let engineer: string;
  const slug = `test-plate-${Date.now()}`;
  // Version numbers of the two concurrent drafts: which author gets which is decided by the race.
  let authorsDraft = 0;
  let author2sDraft = 0;

  beforeAll(async () => {
    author = await freshUser(['author'], 'author');
    author2 = await freshUser(['author'], 'author2');
    dual = await freshUser(['author', 'approver'], 'dual');
    approver = (await signIn('approver@demo.example')).cookie!;
    approver2 = (await signIn('approver2@demo.example')).cookie!;
    engineer = (await signIn('engineer@demo.example')).cookie!;
  });
  afterAll(() => closeSequelize());

  it('lets only authors create correlations, and refuses a malformed definition without writing anything', async () => {
    expect((await call('/api/correlations', { cookie: engineer, body: { slug, definition: plateDefinition(), checkCases: plateCases() } })).body.error.code).toBe('forbidden:role');
    const bad = await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: { ...plateDefinition(), category: 'heat', inputs: [] }, checkCases: [] } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.code).toBe('invalid:definition');
    expect(bad.body.error.details.issues.map((i: { path: string }) => i.path)).toEqual(expect.arrayContaining(['definition/category', 'definition/inputs']));
    const badCase = await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(), checkCases: [{ label: 'x', inputs: {}, expected: {}, tolerance: {}, source: { kind: 'published', citation: 'a book' } }] } });
    expect(badCase.status).toBe(422);
    expect(badCase.body.error.details.issues.map((i: { path: string }) => i.path)).toEqual(expect.arrayContaining(['checkCases/0/tolerance', 'checkCases/0/source']));
    expect((await snapshot(slug)).versions).toBe(0);
    const ok = await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(), checkCases: plateCases(0.332, 0.3) } });
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ slug, version: 1 });
  });

  it('hides drafts from engineers and other authors, shows them to approvers', async () => {
    expect((await call(`/api/correlations/${slug}/versions/1`, { cookie: engineer })).status).toBe(404);
    expect((await call(`/api/correlations/${slug}/versions/1`, { cookie: author2.cookie })).status).toBe(404);
    expect((await call(`/api/correlations/${slug}/versions/1`, { cookie: approver })).body.status).toBe('draft');
    expect((await call(`/api/correlations/${slug}/versions/1`, { cookie: author2.cookie, method: 'PATCH', body: { definition: plateDefinition() } })).body.error.code).toBe('forbidden:not-author');
  });

  it('refuses to submit a version whose check case fails, and leaves the database unchanged', async () => {
    const before = await snapshot(slug);
    const res = await call(`/api/correlations/${slug}/versions/1/submit`, { cookie: author.cookie, method: 'POST' });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('invalid:validation-failed');
    expect(res.body.error.details.report.cases.filter((c: { passed: boolean }) => !c.passed)).toHaveLength(3);
    expect(await snapshot(slug)).toEqual(before);
  });

  it('submits after the fix, freezes the version and tells the approvers', async () => {
    expect((await call(`/api/correlations/${slug}/versions/1`, { cookie: author.cookie, method: 'PATCH', body: { checkCases: plateCases() } })).status).toBe(200);
    const res = await call(`/api/correlations/${slug}/versions/1/submit`, { cookie: author.cookie, method: 'POST' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('in_review');
    expect(res.body.contentHash).toMatch(/^[0-9a-f]{64}$/);
    const frozen = await call(`/api/correlations/${slug}/versions/1`, { cookie: author.cookie, method: 'PATCH', body: { definition: plateDefinition(0.4) } });
    expect(frozen.status).toBe(409);
    expect(frozen.body.error.code).toBe('conflict:frozen');
    expect(mailTo('approver@demo.example').some((m) => m.subject.includes('Review requested') && m.text.includes(slug))).toBe(true);
  });

  it('refuses sign-off with a wrong password and by an engineer, changing nothing', async () => {
    const before = await snapshot(slug);
    const wrong = await call(`/api/correlations/${slug}/versions/1/decision`, { cookie: approver, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'ok', password: 'wrong-password' } });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.code).toBe('invalid:password');
    expect((await call(`/api/correlations/${slug}/versions/1/decision`, { cookie: engineer, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'ok', password: DEMO_PASSWORD } })).status).toBe(403);
    expect(await snapshot(slug)).toEqual(before);
  });

  it('lets exactly one of two simultaneous approvals land; the other gets 409', async () => {
    const [a, b] = await Promise.all([approver, approver2].map((cookie) => call(`/api/correlations/${slug}/versions/1/decision`, { cookie, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'Reviewed.', password: DEMO_PASSWORD } })));
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    expect([a, b].find((r) => r.status === 409)!.body.error.code).toBe('conflict:version-state');
    const detail = await call(`/api/correlations/${slug}/versions/1`, { cookie: engineer });
    expect(detail.body.status).toBe('approved');
    expect(detail.body.signOffs).toHaveLength(1);
    expect(detail.body.signOffs[0].meaning).toMatch(/reviewed the definition, references and validation report; approved for use/);
    expect(mailTo(author.user.email).some((m) => m.subject.includes('approved'))).toBe(true);
  });

  it('enforces four-eyes in the service: an author-approver cannot approve their own version', async () => {
    const own = `test-own-${Date.now()}`;
    await call('/api/correlations', { cookie: dual.cookie, body: { slug: own, definition: plateDefinition(), checkCases: plateCases() } });
    await call(`/api/correlations/${own}/versions/1/submit`, { cookie: dual.cookie, method: 'POST' });
    const before = await snapshot(own);
    const res = await call(`/api/correlations/${own}/versions/1/decision`, { cookie: dual.cookie, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'mine', password: dual.password } });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden:approve-own-version');
    expect(await snapshot(own)).toEqual(before);
  });

  it('gives two authors drafting at once distinct version numbers', async () => {
    const [a, b] = await Promise.all([author, author2].map((u) => call(`/api/correlations/${slug}/versions`, { cookie: u.cookie, body: {} })));
    expect(a.status).toBe(200);
    expect(b.status).toBe(200);
    expect([a.body.version, b.body.version].sort()).toEqual([2, 3]);
    authorsDraft = a.body.version;
    author2sDraft = b.body.version;
  });

  it('returns a version with a comment; a returned version is frozen', async () => {
    await call(`/api/correlations/${slug}/versions/${author2sDraft}`, { cookie: author2.cookie, method: 'PATCH', body: { definition: plateDefinition(0.34), checkCases: plateCases(0.34) } });
    expect((await call(`/api/correlations/${slug}/versions/${author2sDraft}/submit`, { cookie: author2.cookie, method: 'POST' })).status).toBe(200);
    const noComment = await call(`/api/correlations/${slug}/versions/${author2sDraft}/decision`, { cookie: approver2, body: { decision: 'return', comment: '  ' } });
    expect(noComment.body.error.code).toBe('invalid:comment');
    const ret = await call(`/api/correlations/${slug}/versions/${author2sDraft}/decision`, { cookie: approver2, body: { decision: 'return', comment: 'The coefficient 0.34 has no source.' } });
    expect(ret.body.status).toBe('returned');
    expect((await call(`/api/correlations/${slug}/versions/${author2sDraft}`, { cookie: author2.cookie, method: 'PATCH', body: { definition: plateDefinition() } })).status).toBe(409);
    expect(mailTo(author2.user.email).some((m) => m.text.includes('The coefficient 0.34 has no source.'))).toBe(true);
  });

  it('supersedes the approved version when a newer one is approved, keeping exactly one approved', async () => {
    await call(`/api/correlations/${slug}/versions/${authorsDraft}`, { cookie: author.cookie, method: 'PATCH', body: { definition: plateDefinition(0.3321), checkCases: plateCases(0.3321) } });
    await call(`/api/correlations/${slug}/versions/${authorsDraft}/submit`, { cookie: author.cookie, method: 'POST' });
    expect((await call(`/api/correlations/${slug}/versions/${authorsDraft}/decision`, { cookie: approver, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'ok', password: DEMO_PASSWORD } })).status).toBe(200);
    const c = await call(`/api/correlations/${slug}`, { cookie: approver });
    expect(c.body.latestApprovedVersion).toBe(authorsDraft);
    const statuses = Object.fromEntries(c.body.versions.map((v: { version: number; status: string }) => [v.version, v.status]));
    expect(statuses).toEqual({ 1: 'superseded', [authorsDraft]: 'approved', [author2sDraft]: 'returned' });
    // Engineers see published versions only: the returned one stays with its author and the approvers.
    const seen = await call(`/api/correlations/${slug}`, { cookie: engineer });
    expect(seen.body.versions.map((v: { version: number }) => v.version).sort()).toEqual([1, authorsDraft]);
  });

  it('withdraws with a reason, notifies users of the version, and never serves it as latest', async () => {
    const used = await call(`/api/correlations/${slug}/evaluate`, { cookie: engineer, body: { inputs: { Re_x: 1e4, Pr: 0.7 } } });
    expect(used.body.version).toBe(authorsDraft);
    const short = await call(`/api/correlations/${slug}/versions/${authorsDraft}/withdraw`, { cookie: approver2, body: { reason: 'bad' } });
    expect(short.body.error.code).toBe('invalid:reason');
    // A withdrawal is signed like an approval: no password, or a wrong one, and nothing changes.
    const unsigned = await call(`/api/correlations/${slug}/versions/${authorsDraft}/withdraw`, { cookie: approver2, body: { reason: 'Coefficient typed with an extra digit; use version 1 values.' } });
    expect(unsigned.status).toBe(422);
    expect(unsigned.body.error.details.issues[0].path).toBe('password');
    const wrong = await call(`/api/correlations/${slug}/versions/${authorsDraft}/withdraw`, { cookie: approver2, body: { reason: 'Coefficient typed with an extra digit; use version 1 values.', password: 'not-my-password' } });
    expect(wrong.body.error.code).toBe('invalid:password');
    expect((await call(`/api/correlations/${slug}/versions/${authorsDraft}`, { cookie: approver2 })).body.status).toBe('approved');
    const w = await call(`/api/correlations/${slug}/versions/${authorsDraft}/withdraw`, { cookie: approver2, body: { reason: 'Coefficient typed with an extra digit; use version 1 values.', password: DEMO_PASSWORD } });
    expect(w.status).toBe(200);
    expect(w.body.notified).toContain('engineer@demo.example');
    expect(mailTo('engineer@demo.example').some((m) => m.subject.includes('Withdrawn') && m.text.includes('extra digit'))).toBe(true);
    const latest = await call(`/api/correlations/${slug}/evaluate`, { cookie: engineer, body: { inputs: { Re_x: 1e4, Pr: 0.7 } } });
    expect(latest.status).toBe(404);
    expect(latest.body.error.code).toBe('not_found:approved-version');
    const pinned = await call(`/api/correlations/${slug}/evaluate`, { cookie: engineer, body: { version: authorsDraft, inputs: { Re_x: 1e4, Pr: 0.7 } } });
    expect(pinned.status).toBe(200);
    expect(pinned.body.warnings[0]).toMatchObject({ symbol: 'version', value: authorsDraft });
    expect(pinned.body.warnings[0].message).toMatch(/withdrawn/);
    const again = await call(`/api/correlations/${slug}/versions/${authorsDraft}/decision`, { cookie: approver, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'x', password: DEMO_PASSWORD } });
    expect(again.status).toBe(409);
  });

  it('refuses to serve a frozen version whose stored content was tampered with, and raises an alarm', async () => {
    const tamper = `test-tamper-${Date.now()}`;
    await call('/api/correlations', { cookie: author.cookie, body: { slug: tamper, definition: plateDefinition(), checkCases: plateCases() } });
    await call(`/api/correlations/${tamper}/versions/1/submit`, { cookie: author.cookie, method: 'POST' });
    await call(`/api/correlations/${tamper}/versions/1/decision`, { cookie: approver, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'ok', password: DEMO_PASSWORD } });
    const { sequelize } = db();
    await sequelize.query(`UPDATE correlation_versions v JOIN correlations c ON c.id = v.correlation_id
      SET v.definition = REPLACE(v.definition, '0.332 *', '0.532 *') WHERE c.slug = ?`, { replacements: [tamper], type: QueryTypes.UPDATE });
    const res = await call(`/api/correlations/${tamper}/evaluate`, { cookie: engineer, body: { inputs: { Re_x: 1e4, Pr: 0.7 } } });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict:content-hash-mismatch');
    const alarms = await sequelize.query<{ entity_id: string }>("SELECT entity_id FROM audit_events WHERE action = 'integrity.hash-mismatch'", { type: QueryTypes.SELECT });
    expect(alarms.map((a) => a.entity_id)).toContain(`${tamper}@1`);
    const { verifyAllContent } = await import('@/lib/governance/content-check');
    expect((await verifyAllContent()).mismatches).toContain(`${tamper} version 1`);
    // Undo the forgery so the database stays intact for the tests that follow.
    await sequelize.query(`UPDATE correlation_versions v JOIN correlations c ON c.id = v.correlation_id
      SET v.definition = REPLACE(v.definition, '0.532 *', '0.332 *') WHERE c.slug = ?`, { replacements: [tamper], type: QueryTypes.UPDATE });
    expect((await verifyAllContent()).mismatches).toEqual([]);
  });

  it('refuses every life-cycle action to the roles that may not take it', async () => {
    const target = `test-matrix-${Date.now()}`;
    await call('/api/correlations', { cookie: author.cookie, body: { slug: target, definition: plateDefinition(), checkCases: plateCases() } });
    const cookies: Record<string, string> = {};
    for (const who of ['admin', 'engineer', 'integrator', 'author', 'approver']) cookies[who] = (await signIn(`${who}@demo.example`)).cookie!;
    const actions: Record<string, { path: string; method?: string; body?: unknown; allowed: string[] }> = {
      create: { path: '/api/correlations', body: { slug: `${target}-x`, definition: plateDefinition(), checkCases: [] }, allowed: ['author'] },
      draft: { path: `/api/correlations/${target}/versions`, body: {}, allowed: ['author'] },
      edit: { path: `/api/correlations/${target}/versions/1`, method: 'PATCH', body: { checkCases: plateCases() }, allowed: ['author'] },
      submit: { path: `/api/correlations/${target}/versions/1/submit`, method: 'POST', allowed: ['author'] },
      decide: { path: `/api/correlations/${target}/versions/1/decision`, body: { decision: 'return', comment: 'no' }, allowed: ['approver'] },
      withdraw: { path: `/api/correlations/${target}/versions/1/withdraw`, body: { reason: 'a reason long enough', password: DEMO_PASSWORD }, allowed: ['approver'] },
      validate: { path: `/api/correlations/${target}/versions/1/validate`, method: 'POST', allowed: ['author', 'approver'] },
    };
    for (const [name, a] of Object.entries(actions)) {
      for (const [who, cookie] of Object.entries(cookies)) {
        if (a.allowed.includes(who)) continue;
        const res = await call(a.path, { cookie, method: a.method, body: a.body });
        expect(res.status, `${who} ${name}`).toBe(403);
        expect(res.body.error.code, `${who} ${name}`).toBe('forbidden:role');
      }
    }
    // The demo author holds the role but not this draft: the service refuses too.
    expect((await call(actions.edit.path, { cookie: cookies.author, method: 'PATCH', body: actions.edit.body })).body.error.code).toBe('forbidden:not-author');
    expect((await call(actions.submit.path, { cookie: cookies.author, method: 'POST' })).body.error.code).toBe('forbidden:not-author');
    // Acting on a draft an approver may see but not decide: 409, nothing changes.
    expect((await call(actions.decide.path, { cookie: cookies.approver, body: actions.decide.body })).status).toBe(409);
    expect((await call(actions.withdraw.path, { cookie: cookies.approver, body: actions.withdraw.body })).status).toBe(409);
  });

  it('verifies the audit chain and finds a tampered row (service and npm run audit:verify)', async () => {
    expect((await verifyAuditChain()).intact).toBe(true);
    const { sequelize } = db();
    const [victim] = await sequelize.query<{ id: number; details: string }>("SELECT id, details FROM audit_events WHERE action = 'version.approved' ORDER BY id LIMIT 1", { type: QueryTypes.SELECT });
    await sequelize.query('UPDATE audit_events SET details = ? WHERE id = ?', { replacements: [JSON.stringify({ comment: 'forged' }), victim.id], type: QueryTypes.UPDATE });
    try {
      const status = await verifyAuditChain();
      expect(status).toMatchObject({ intact: false, firstBrokenId: victim.id });
      let exit = 0;
      let output = '';
      try {
        execFileSync('bash', ['scripts/tsx.sh', 'scripts/audit-verify.ts'], { env: process.env, encoding: 'utf8', stdio: 'pipe' });
      } catch (err) {
        exit = (err as { status: number }).status;
        output = String((err as { stderr: string }).stderr);
      }
      expect(exit).toBe(1);
      expect(output).toContain(`BROKEN at event ${victim.id}`);
    } finally {
      await sequelize.query('UPDATE audit_events SET details = ? WHERE id = ?', { replacements: [victim.details, victim.id], type: QueryTypes.UPDATE });
    }
    expect((await verifyAuditChain()).intact).toBe(true);
  });
});

describe('races on unique names', () => {
  afterAll(() => closeSequelize());

  it('lets one of two simultaneous creations of the same slug land; the other gets 409, not a server error', async () => {
    const author = await freshUser(['author'], 'race');
    const slug = `test-race-${Date.now()}`;
    const answers = await Promise.all([0, 1, 2].map(() => call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(), checkCases: plateCases() } })));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409, 409]);
    for (const a of answers.filter((x) => x.status === 409)) expect(a.body.error.code).toMatch(/^conflict:(slug|duplicate)$/);
  });
});
