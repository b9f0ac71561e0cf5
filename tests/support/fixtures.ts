import { createUser, type AuthUser } from '@/lib/auth/users';
import type { Role } from '@/models';
import { signIn } from './http';

/** A fresh user with the given roles and a session cookie for the running test server. */
export async function freshUser(roles: Role[], tag: string): Promise<{ user: AuthUser; cookie: string; password: string }> {
  const password = `pw-${tag}-0123456789`;
  const email = `${tag}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@test.example`;
  const user = await createUser({ actorId: null, email, name: `Test ${tag}`, password, roles });
  const { cookie, error } = await signIn(email, password);
  if (!cookie) throw new Error(`sign-in failed for ${email}: ${error}`);
  return { user, cookie, password };
}

/** Test correlations are synthetic laws with no outside evidence: their approval carries this waiver. */
export const FIXTURE_WAIVER = 'test fixture: a synthetic law with no external evidence';

/** A small, valid definition: a laminar flat-plate local Nusselt number with a coefficient to vary. */
export function plateDefinition(coefficient = 0.332) {
  return {
    schemaVersion: 1,
    title: `Test plate correlation ${coefficient}`,
    summary: 'Laminar flat-plate local Nusselt number used by the integration tests.',
    category: 'external-flow', situation: 'test situation', tags: ['test'],
    inputs: [{ symbol: 'Re_x', name: 'local Reynolds number', unit: '1' }, { symbol: 'Pr', name: 'Prandtl number', unit: '1' }],
    outputs: [{ symbol: 'Nu_x', name: 'local Nusselt number', unit: '1', expression: `${coefficient} * Re_x^(1/2) * Pr^(1/3)` }],
    validity: [{ symbol: 'Re_x', min: 100, max: 5e5 }, { symbol: 'Pr', min: 0.6, max: 50 }],
    references: [{ citation: 'Pohlhausen (1921) Z. Angew. Math. Mech. 1:115', locator: 'test' }],
  };
}

/** Check cases for plateDefinition(coefficient): in-range values computed from the same law, spread over the range. */
export function plateCases(coefficient = 0.332, expectedCoefficient = coefficient) {
  const nu = (re: number, pr: number) => expectedCoefficient * Math.sqrt(re) * Math.cbrt(pr);
  const c = (label: string, re: number, pr: number) => ({
    label, inputs: { Re_x: re, Pr: pr }, expected: { Nu_x: nu(re, pr) }, tolerance: { rel: 1e-9, why: 'same arithmetic' },
    source: { kind: 'common-practice', citation: 'arithmetic of the test law' },
  });
  return [c('low', 300, 0.7), c('mid', 2e4, 5), c('high', 4e5, 40), {
    label: 'out of range', inputs: { Re_x: 1e6, Pr: 0.7 }, expected: { Nu_x: coefficient * 1000 * Math.cbrt(0.7) }, tolerance: { rel: 1e-9 },
    source: { kind: 'common-practice', citation: 'validity range' }, expectWarnings: ['Re_x'],
  }];
}
