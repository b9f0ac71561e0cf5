import { requireRole } from '@/lib/auth/page';

export default async function ReviewPage() {
  await requireRole(['approver']);
  return <h1 className="text-xl font-semibold">Review queue</h1>;
}
