import { route } from '@/lib/http/handler';
import { calculationQuery, idParam } from '@/lib/api/contract';
import { calculationCsv } from '@/lib/calculations/records';

export const GET = route('GET /api/calculations/{id}/csv', { params: idParam, query: calculationQuery }, async ({ caller, params, query }) => {
  const { filename, text } = await calculationCsv({ actor: caller!.user, id: params.id, revision: query.revision });
  return new Response(text, { headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="${filename}"`, 'cache-control': 'no-store' } });
});
