import type { Metadata } from 'next';
import { requireUser } from '@/lib/auth/page';
import { TemplateWorkspace } from '@/components/calculation/template-workspace';

export async function generateMetadata({ params }: { params: Promise<{ slug: string }> }): Promise<Metadata> {
  return { title: (await params).slug };
}

export default async function TemplatePage({ params, searchParams }: { params: Promise<{ slug: string }>; searchParams: Promise<{ version?: string }> }) {
  await requireUser();
  const { slug } = await params;
  const { version } = await searchParams;
  const n = Number(version);
  return <TemplateWorkspace slug={slug} version={Number.isInteger(n) && n > 0 ? n : undefined} />;
}
