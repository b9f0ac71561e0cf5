import { z } from 'zod';
import { route } from '@/lib/http/handler';
import { listAuditEvents, verifyAuditChain } from '@/lib/audit/log';

const query = z.object({ page: z.coerce.number().int().min(1).default(1), pageSize: z.coerce.number().int().min(1).max(200).default(50) }).strict();

export const GET = route('GET /api/admin/audit', { query }, async ({ query }) => {
  const [chain, events] = await Promise.all([verifyAuditChain(), listAuditEvents(query)]);
  return { chain, ...events };
});
