import { route } from '@/lib/http/handler';
import { adviceBody } from '@/lib/api/contract';
import { advise, situations } from '@/lib/evaluation/advisor';

export const GET = route('GET /api/advice', {}, async () => situations());

export const POST = route('POST /api/advice', { body: adviceBody, maxBody: 64_000 }, async ({ caller, body }) => {
  return advise({ actor: caller!.user, tokenId: caller!.tokenId, request: body });
});
