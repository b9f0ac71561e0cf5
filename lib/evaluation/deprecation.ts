import 'server-only';
import { NextResponse } from 'next/server';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';

/**
 * A pinned version that is no longer the approved one still answers (with a warning in the body), and
 * says so in headers tools can read: `Deprecation` (RFC 9745: since when, as @epoch-seconds) and
 * `Link: <…>; rel="successor-version"` to the approved version when there is one (templates' versions are
 * read at the same path as correlations').
 */
export async function withDeprecation(answer: { slug: string | null; version: number | null; status: string | null }): Promise<Response> {
  const headers: Record<string, string> = { 'cache-control': 'no-store' };
  if (answer.slug && (answer.status === 'superseded' || answer.status === 'withdrawn')) {
    const [row] = await db().sequelize.query<{ since: Date | null; successor: number | null }>(`
      SELECT (SELECT COALESCE(v.withdrawn_at, v.superseded_at) FROM correlation_versions v WHERE v.correlation_id = c.id AND v.version = ?) AS since,
             (SELECT a.version FROM correlation_versions a WHERE a.correlation_id = c.id AND a.status = 'approved' LIMIT 1) AS successor
      FROM correlations c WHERE c.slug = ?`, { replacements: [answer.version, answer.slug], type: QueryTypes.SELECT });
    if (row?.since) headers.Deprecation = `@${Math.floor(new Date(row.since).getTime() / 1000)}`;
    if (row?.successor) headers.Link = `</api/correlations/${answer.slug}/versions/${row.successor}>; rel="successor-version"`;
  }
  return NextResponse.json(answer, { headers });
}
