/**
 * A typed TypeScript client in a few lines: openapi-fetch with the types openapi-typescript generates from
 * /api/openapi.json (committed as lib/client/api-types.ts; generate your own copy with
 * `npx openapi-typescript http://localhost:3000/api/openapi.json -o api-types.ts`). Paths, bodies and answers are
 * checked by the compiler. The test suite calls this function against the test server (tests/integration/api.test.ts).
 */
import createClient from 'openapi-fetch';
import type { paths } from '../../lib/client/api-types';

export async function evaluatePinned(baseUrl: string, token: string, slug: string, version: number, inputs: Record<string, number>) {
  const client = createClient<paths>({ baseUrl, headers: { Authorization: `Bearer ${token}` } });
  const { data, error } = await client.POST('/api/correlations/{slug}/evaluate', {
    params: { path: { slug } },
    body: { version, inputs },
  });
  if (error) throw new Error(`${error.error.code}: ${error.error.message}`);
  // data is typed: outputs, warnings, bands, version and contentHash as the description states them.
  return { outputs: data.outputs ?? {}, warnings: (data.warnings ?? []).map((w) => w.message), version: data.version, contentHash: data.contentHash };
}
