import { route } from '@/lib/http/handler';
import { templatesQuery } from '@/lib/api/contract';
import { listCorrelations } from '@/lib/governance/queries';

/** Calculation templates with their latest approved version (drafts only for their authors and approvers). */
export const GET = route('GET /api/templates', { query: templatesQuery }, async ({ caller, query }) => {
  const list = await listCorrelations({ actor: caller!.user, query: { ...query, sort: 'title' }, kind: 'template' });
  return {
    items: list.items.map((t) => ({
      slug: t.slug, title: t.title, category: t.category, situation: t.situation,
      version: t.latestApprovedVersion, contentHash: t.approvedContentHash, status: t.latestApprovedVersion ? 'approved' : t.latestStatus,
    })),
    total: list.total,
  };
});
