import { afterAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { BASE, call } from '../support/http';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { createApiToken } from '@/lib/api/tokens';

/** The one-file Python client (clients/python/correlary.py), run by Debian's python3 against the running app. */
describe('the Python client', () => {
  afterAll(() => closeSequelize());

  it('is served by the app as the file in the repository', async () => {
    const res = await fetch(`${BASE}/api/clients/correlary.py`);
    expect(res.status).toBe(200);
    expect(await res.text()).toMatch(/^"""Correlary client/);
  });

  it('passes its own tests: single, rows, units, warnings, errors, pinned version and ETag, search, template, Retry-After, the webhook signature check', async () => {
    const integrator = (await db().User.findOne({ where: { email: 'integrator@demo.example' } }))!.id;
    const { token } = await createApiToken({ actorId: null, userId: integrator, name: 'python client', scopes: ['read', 'evaluate'], expiresAt: null });
    expect((await call('/api/correlations?pageSize=1', { token })).status).toBe(200);
    const run = spawnSync('/usr/bin/python3', ['clients/python/test_correlary.py'], {
      env: { ...process.env, CORRELARY_URL: BASE, CORRELARY_TOKEN: token, PYTHONPATH: 'clients/python', PYTHONDONTWRITEBYTECODE: '1' }, encoding: 'utf8',
    });
    expect(run.status, run.stderr).toBe(0);
    expect(run.stderr).toMatch(/Ran 12 tests/);
    expect(run.stderr).toMatch(/\nOK\s*$/);
  });
});
