import { route } from '@/lib/http/handler';
import { correlationPath } from '@/lib/api/contract';
import { getCorrelation } from '@/lib/governance/queries';

export const GET = route('GET /api/correlations/{slug}', { params: correlationPath }, async ({ caller, params }) =>
  getCorrelation({ actor: caller!.user, slug: params.slug }));
