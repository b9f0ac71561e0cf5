import { route } from '@/lib/http/handler';
import { calculationQuery, idParam } from '@/lib/api/contract';
import { rerunCalculation } from '@/lib/calculations/records';

/** Re-runs a saved revision against the latest approved versions; nothing is saved. */
export const POST = route('POST /api/calculations/{id}/rerun', { params: idParam, query: calculationQuery }, async ({ caller, params, query }) => {
  return rerunCalculation({ actor: caller!.user, tokenId: caller!.tokenId, id: params.id, revision: query.revision });
});
