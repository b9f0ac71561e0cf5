import { route } from '@/lib/http/handler';
import { AppError } from '@/lib/http/errors';
import { versionPath, withdrawBody } from '@/lib/api/contract';
import { withdrawVersion } from '@/lib/governance/lifecycle';

export const POST = route('POST /api/correlations/{slug}/versions/{n}/withdraw', { params: versionPath, body: withdrawBody }, async ({ caller, params, body }) => {
  if (caller!.via !== 'session') throw new AppError('forbidden:session-only', 'Withdrawal needs a signed-in person, not an API token.');
  return withdrawVersion({ actor: caller!.user, slug: params.slug, version: params.n, reason: body.reason, password: body.password });
});
