import { route } from '@/lib/http/handler';
import { createCorrelationBody, listQuery } from '@/lib/api/contract';
import { listCorrelations } from '@/lib/governance/queries';
import { createCorrelation } from '@/lib/governance/lifecycle';

export const GET = route('GET /api/correlations', { query: listQuery }, async ({ caller, query }) =>
  listCorrelations({ actor: caller!.user, query }));

export const POST = route('POST /api/correlations', { body: createCorrelationBody, maxBody: 5_000_000 }, async ({ caller, body }) =>
  createCorrelation({ actor: caller!.user, slug: body.slug, definition: body.definition, checkCases: body.checkCases }));
