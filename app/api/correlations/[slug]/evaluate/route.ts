import { route } from '@/lib/http/handler';
import { withDeprecation } from '@/lib/evaluation/deprecation';
import { correlationPath, evaluateBody } from '@/lib/api/contract';
import { evaluateCorrelation } from '@/lib/evaluation/service';

export const POST = route('POST /api/correlations/{slug}/evaluate', { params: correlationPath, body: evaluateBody, maxBody: 8_000_000 }, async ({ caller, params, body }) => {
  return withDeprecation(await evaluateCorrelation({ actor: caller!.user, tokenId: caller!.tokenId, slug: params.slug, request: body }));
});
