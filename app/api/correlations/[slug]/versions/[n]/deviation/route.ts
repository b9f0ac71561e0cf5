import { z } from 'zod';
import { route } from '@/lib/http/handler';
import { consumeRateLimit } from '@/lib/api/rate-limit';
import { versionPath } from '@/lib/api/contract';
import { deviationFromPrevious } from '@/lib/governance/review';

const query = z.object({ sweep: z.string().max(32).optional(), output: z.string().max(32).optional() }).strict();

export const GET = route('GET /api/correlations/{slug}/versions/{n}/deviation', { params: versionPath, query }, async ({ caller, params, query }) => {
  // Two versions over 120 points each.
  await consumeRateLimit({ userId: caller!.user.id, tokenId: caller!.tokenId, evaluations: 240 });
  return deviationFromPrevious({ actor: caller!.user, slug: params.slug, version: params.n, sweep: query.sweep, output: query.output });
});
