import type { Metadata } from 'next';
import { requireUser } from '@/lib/auth/page';
import { TemplateList } from '@/components/calculation/template-list';

export const metadata: Metadata = { title: 'Calculation templates' };

export default async function TemplatesPage() {
  await requireUser();
  return <TemplateList />;
}
