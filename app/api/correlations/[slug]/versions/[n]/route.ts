import { NextResponse } from 'next/server';
import { route } from '@/lib/http/handler';
import { updateDraftBody, versionPath } from '@/lib/api/contract';
import { getVersionDetail } from '@/lib/governance/queries';
import { updateDraft } from '@/lib/governance/lifecycle';

/** A frozen version never changes: its content hash is its ETag, and If-None-Match answers 304. */
export const GET = route('GET /api/correlations/{slug}/versions/{n}', { params: versionPath }, async ({ req, caller, params }) => {
  const detail = await getVersionDetail({ actor: caller!.user, slug: params.slug, version: params.n });
  // Status and sign-offs can still change (approved → superseded), so the tag covers them too.
  const etag = detail.contentHash ? `"${detail.contentHash}-${detail.status}-${detail.signOffs.length}"` : null;
  if (etag && req.headers.get('if-none-match') === etag) return new NextResponse(null, { status: 304, headers: { ETag: etag } });
  return NextResponse.json(detail, { headers: etag ? { ETag: etag, 'Cache-Control': 'private, no-cache' } : { 'Cache-Control': 'no-store' } });
});

export const PATCH = route('PATCH /api/correlations/{slug}/versions/{n}', { params: versionPath, body: updateDraftBody, maxBody: 5_000_000 }, async ({ caller, params, body }) =>
  updateDraft({ actor: caller!.user, slug: params.slug, version: params.n, definition: body.definition, checkCases: body.checkCases }));
