import type { Metadata } from 'next';
import { requireUser } from '@/lib/auth/page';
import { CalculationReport } from '@/components/calculation/calculation-report';

export const metadata: Metadata = { title: 'Calculation report' };

export default async function ReportPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ revision?: string }> }) {
  await requireUser();
  const { revision } = await searchParams;
  const n = Number(revision);
  return <CalculationReport id={Number((await params).id)} revision={Number.isInteger(n) && n > 0 ? n : undefined} />;
}
