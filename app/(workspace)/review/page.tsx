import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/page';
import { ReviewQueue } from '@/components/review/review-queue';

export const metadata: Metadata = { title: 'Review queue' };

export default async function ReviewPage() {
  await requireRole(['approver']);
  return (
    <div className="space-y-4">
      <h1 className="text-xl font-semibold">Review queue</h1>
      <ReviewQueue />
    </div>
  );
}
