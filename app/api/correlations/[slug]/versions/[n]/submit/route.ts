import { route } from '@/lib/http/handler';
import { versionPath } from '@/lib/api/contract';
import { submitVersion } from '@/lib/governance/lifecycle';

export const POST = route('POST /api/correlations/{slug}/versions/{n}/submit', { params: versionPath }, async ({ caller, params }) =>
  submitVersion({ actor: caller!.user, slug: params.slug, version: params.n }));
