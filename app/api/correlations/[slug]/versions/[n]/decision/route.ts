import { route } from '@/lib/http/handler';
import { AppError } from '@/lib/http/errors';
import { decisionBody, versionPath } from '@/lib/api/contract';
import { decideVersion } from '@/lib/governance/lifecycle';

export const POST = route('POST /api/correlations/{slug}/versions/{n}/decision', { params: versionPath, body: decisionBody }, async ({ caller, params, body }) => {
  if (caller!.via !== 'session') throw new AppError('forbidden:session-only', 'Sign-off needs a signed-in person, not an API token.');
  return decideVersion({ actor: caller!.user, slug: params.slug, version: params.n, ...body });
});
