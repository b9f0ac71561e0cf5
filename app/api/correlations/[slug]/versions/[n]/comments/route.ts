import { route } from '@/lib/http/handler';
import { commentBody, versionPath } from '@/lib/api/contract';
import { addComment } from '@/lib/governance/lifecycle';

export const POST = route('POST /api/correlations/{slug}/versions/{n}/comments', { params: versionPath, body: commentBody }, async ({ caller, params, body }) =>
  addComment({ actor: caller!.user, slug: params.slug, version: params.n, body: body.body }));
