import { route } from '@/lib/http/handler';
import { correlationPath, newVersionBody } from '@/lib/api/contract';
import { createDraftVersion } from '@/lib/governance/lifecycle';

export const POST = route('POST /api/correlations/{slug}/versions', { params: correlationPath, body: newVersionBody }, async ({ caller, params, body }) =>
  createDraftVersion({ actor: caller!.user, slug: params.slug, fromVersion: body.fromVersion }));
