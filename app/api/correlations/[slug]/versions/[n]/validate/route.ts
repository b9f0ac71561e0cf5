import { route } from '@/lib/http/handler';
import { versionPath } from '@/lib/api/contract';
import { previewValidation } from '@/lib/governance/lifecycle';

/** Live validation of the version's current content; nothing is stored. */
export const POST = route('POST /api/correlations/{slug}/versions/{n}/validate', { params: versionPath }, async ({ caller, params }) =>
  previewValidation({ actor: caller!.user, slug: params.slug, version: params.n }));
