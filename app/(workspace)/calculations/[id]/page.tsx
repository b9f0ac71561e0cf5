import type { Metadata } from 'next';
import { requireUser } from '@/lib/auth/page';
import { CalculationView } from '@/components/calculation/calculation-view';

export const metadata: Metadata = { title: 'Calculation' };

export default async function CalculationPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ revision?: string; saved?: string }> }) {
  await requireUser();
  const { revision, saved } = await searchParams;
  const n = Number(revision);
  return <CalculationView id={Number((await params).id)} revision={Number.isInteger(n) && n > 0 ? n : undefined} justSaved={saved === '1'} />;
}
