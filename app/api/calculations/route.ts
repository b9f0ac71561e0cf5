import { route } from '@/lib/http/handler';
import { calculationsQuery, saveCalculationBody } from '@/lib/api/contract';
import { listCalculations, saveCalculation } from '@/lib/calculations/records';

export const GET = route('GET /api/calculations', { query: calculationsQuery }, async ({ caller, query }) =>
  listCalculations({ actor: caller!.user, project: query.project }));

export const POST = route('POST /api/calculations', { body: saveCalculationBody, maxBody: 8_000_000 }, async ({ caller, body }) => {
  return saveCalculation({ actor: caller!.user, tokenId: caller!.tokenId, request: body });
});
