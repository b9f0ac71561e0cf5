import { route } from '@/lib/http/handler';
import { calculationQuery, idParam } from '@/lib/api/contract';
import { getCalculation } from '@/lib/calculations/records';

export const GET = route('GET /api/calculations/{id}', { params: idParam, query: calculationQuery }, async ({ caller, params, query }) =>
  getCalculation({ actor: caller!.user, id: params.id, revision: query.revision }));
