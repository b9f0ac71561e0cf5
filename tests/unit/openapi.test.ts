import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Spectral, Document } from '@stoplight/spectral-core';
import { oas } from '@stoplight/spectral-rulesets';
import { Json } from '@stoplight/spectral-parsers';
import { openApiDocument } from '@/lib/api/openapi';
import { EXAMPLES } from '@/lib/api/openapi-examples';
import { generateApiTypes } from '@/lib/api/types-source';
import * as C from '@/lib/api/contract';

const doc = openApiDocument('http://localhost:3000');

describe('the API description', () => {
  it('lints clean with every rule of Spectral’s OpenAPI ruleset (spectral:oas, all)', async () => {
    const spectral = new Spectral();
    spectral.setRuleset({ extends: [[oas as never, 'all']] } as never);
    const results = await spectral.run(new Document(JSON.stringify(doc), Json));
    expect(results.map((r) => `${r.code} at ${r.path.join('.')}: ${r.message}`)).toEqual([]);
  });

  it('gives every operation a summary, a description, a tag and its 4xx answers', () => {
    const ops = [...Object.entries(doc.paths), ...Object.entries(doc.webhooks)].flatMap(([path, item]) => Object.entries(item as Record<string, { summary?: string; description?: string; tags?: string[]; responses: Record<string, unknown> }>).map(([m, o]) => ({ at: `${m} ${path}`, o })));
    expect(ops.length).toBeGreaterThan(30);
    for (const { at, o } of ops) {
      expect(o.summary, at).toBeTruthy();
      expect(o.description, at).toBeTruthy();
      expect(o.tags?.length, at).toBe(1);
      // The health check is public and takes no input: it has no client error to describe.
      if (at !== 'get /api/health') expect(Object.keys(o.responses).some((c) => c.startsWith('4')), `${at}: a 4xx answer`).toBe(true);
    }
  });

  it('holds examples the contract itself accepts (each parsed by its zod schema)', () => {
    const pairs: [string, { safeParse(v: unknown): { success: boolean; error?: unknown } }, unknown][] = [
      ['listAnswer', C.listAnswer, EXAMPLES.listAnswer], ['correlationAnswer', C.correlationAnswer, EXAMPLES.correlationAnswer], ['versionAnswer', C.versionAnswer, EXAMPLES.versionAnswer],
      ['evaluateBody', C.evaluateBody, EXAMPLES.evaluateBody], ['evaluateRowsBody', C.evaluateBody, EXAMPLES.evaluateRowsBody], ['evaluateAnswer', C.evaluateAnswer, EXAMPLES.evaluateAnswer],
      ['error', C.errorAnswer, EXAMPLES.error], ['templatesAnswer', C.templateListAnswer, EXAMPLES.templatesAnswer], ['runBody', C.runBody, EXAMPLES.runBody], ['runAnswer', C.runAnswer, EXAMPLES.runAnswer],
      ['situationsAnswer', C.situationsAnswer, EXAMPLES.situationsAnswer], ['adviceBody', C.adviceBody, EXAMPLES.adviceBody], ['adviceAnswer', C.adviceAnswer, EXAMPLES.adviceAnswer],
      ['registerWebhookBody', C.registerWebhookBody, EXAMPLES.registerWebhookBody], ['registerWebhookAnswer', C.registerWebhookAnswer, EXAMPLES.registerWebhookAnswer],
      ['allowlistBody', C.allowlistBody, EXAMPLES.allowlistBody], ['webhookDelivery', C.webhookDeliveryBody, EXAMPLES.webhookDelivery],
    ];
    for (const [name, s, value] of pairs) expect(s.safeParse(value).success, name).toBe(true);
  });

  it('has its generated TypeScript types committed and up to date (npm run api:types)', async () => {
    const committed = readFileSync(join(process.cwd(), 'lib', 'client', 'api-types.ts'), 'utf8');
    expect(committed === (await generateApiTypes()), 'lib/client/api-types.ts is out of date with the API description: run npm run api:types').toBe(true);
  });
});
