import { route } from '@/lib/http/handler';
import { withDeprecation } from '@/lib/evaluation/deprecation';
import { correlationPath, runBody } from '@/lib/api/contract';
import { runTemplate } from '@/lib/evaluation/service';

export const POST = route('POST /api/templates/{slug}/run', { params: correlationPath, body: runBody, maxBody: 8_000_000 }, async ({ caller, params, body }) => {
  return withDeprecation(await runTemplate({ actor: caller!.user, tokenId: caller!.tokenId, slug: params.slug, request: body }));
});
