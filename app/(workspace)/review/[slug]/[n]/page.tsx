import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/page';
import { ReviewView } from '@/components/review/review-view';

export const metadata: Metadata = { title: 'Review' };

export default async function ReviewVersionPage({ params }: { params: Promise<{ slug: string; n: string }> }) {
  const user = await requireRole(['approver']);
  const { slug, n } = await params;
  return <ReviewView slug={slug} version={Number(n)} userId={user.id} />;
}
