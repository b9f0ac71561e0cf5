import { route } from '@/lib/http/handler';
import { consumeRateLimit } from '@/lib/api/rate-limit';
import { AppError } from '@/lib/http/errors';
import { compareBody } from '@/lib/api/contract';
import { compareDefinitions } from '@/lib/engine';
import { loadVerifiedCorrelation } from '@/lib/evaluation/verified';

export const POST = route('POST /api/compare', { body: compareBody }, async ({ caller, body }) => {
  await consumeRateLimit({ userId: caller!.user.id, tokenId: caller!.tokenId, evaluations: body.items.length * body.points });
  const items = await Promise.all(body.items.map(async (it) => {
    const { version, compiled } = await loadVerifiedCorrelation({ actor: caller!.user, slug: it.slug, version: it.version });
    return { label: `${version.title} (v${version.version})`, slug: it.slug, version: version.version, definition: compiled.definition };
  }));
  try {
    return compareDefinitions({ items, sweep: body.sweep, output: body.output, fixed: body.fixed, from: body.from, to: body.to, points: body.points });
  } catch (err) {
    throw new AppError('invalid:comparison', (err as Error).message);
  }
});
