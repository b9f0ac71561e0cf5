import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/page';
import { DraftEditor } from '@/components/author/draft-editor';

export const metadata: Metadata = { title: 'Edit draft' };

export default async function DraftPage({ params }: { params: Promise<{ slug: string; n: string }> }) {
  const user = await requireRole(['author']);
  const { slug, n } = await params;
  return <DraftEditor slug={slug} version={Number(n)} userId={user.id} />;
}
