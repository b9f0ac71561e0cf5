import { route } from '@/lib/http/handler';
import { versionPath } from '@/lib/api/contract';
import { submitVersion } from '@/lib/governance/lifecycle';

export const POST = route({ access: { roles: ['author'], scope: 'write' }, params: versionPath }, async ({ caller, params }) =>
  submitVersion({ actor: caller!.user, slug: params.slug, version: params.n }));
