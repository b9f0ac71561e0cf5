import { route } from '@/lib/http/handler';
import { versionPath } from '@/lib/api/contract';
import { usesOfVersion } from '@/lib/governance/uses';
import { resolveVersion } from '@/lib/governance/queries';

/** What uses a version (calculations, templates, evaluations by person): approvers see it before withdrawing. */
export const GET = route('GET /api/correlations/{slug}/versions/{n}/uses', { params: versionPath }, async ({ caller, params }) => {
  const { version } = await resolveVersion({ actor: caller!.user, slug: params.slug, version: params.n });
  return usesOfVersion(version.id);
});
