import { z } from 'zod';
import { route } from '@/lib/http/handler';
import { listAuditEvents, verifyAuditChain, type AuditFilter } from '@/lib/audit/log';

/** At most this many events in one export (narrow the filter for more). */
const EXPORT_LIMIT = 10_000;

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'a date as YYYY-MM-DD');
const query = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  action: z.string().max(60).regex(/^[a-z.-]*$/, 'lower-case letters, dots and hyphens, e.g. "version." or "user.roles-changed"').optional(),
  actor: z.string().max(190).optional(),
  subject: z.string().max(60).optional(),
  from: day.optional(),
  to: day.optional(),
  format: z.enum(['json', 'csv']).default('json'),
}).strict();

const csvCell = (v: unknown) => {
  const text = v === null || v === undefined ? '' : typeof v === 'string' ? v : JSON.stringify(v);
  // Quoted always; a leading = + - @ is neutralised so a spreadsheet never runs it as a formula.
  return `"${(/^[=+\-@]/.test(text) ? `'${text}` : text).replace(/"/g, '""')}"`;
};

export const GET = route('GET /api/admin/audit', { query }, async ({ query }) => {
  const filter: AuditFilter = {
    action: query.action || undefined, actor: query.actor?.trim() || undefined, subject: query.subject?.trim() || undefined,
    from: query.from ? new Date(`${query.from}T00:00:00Z`) : undefined,
    // "to" is inclusive: the whole of that day.
    to: query.to ? new Date(Date.parse(`${query.to}T00:00:00Z`) + 86_400_000) : undefined,
  };
  if (query.format === 'csv') {
    const events = await listAuditEvents({ page: 1, pageSize: EXPORT_LIMIT, filter });
    const header = ['id', 'at_utc', 'actor', 'action', 'subject_type', 'subject', 'before_hash', 'after_hash', 'details', 'event_hash'];
    const lines = events.items.map((e) => [e.id, new Date(e.at).toISOString(), e.actor, e.action, e.entityType, e.entityId, e.beforeHash, e.afterHash, e.details ?? {}, e.hash].map(csvCell).join(','));
    const note = events.total > events.items.length ? `# the newest ${events.items.length} of ${events.total} matching events; narrow the filter for the rest\n` : '';
    return new Response(`${note}${header.join(',')}\n${lines.join('\n')}\n`, {
      headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="correlary-audit-${new Date().toISOString().slice(0, 10)}.csv"` },
    });
  }
  const [chain, events] = await Promise.all([verifyAuditChain(), listAuditEvents({ page: query.page, pageSize: query.pageSize, filter })]);
  return { chain, ...events };
});
