import type { Metadata } from 'next';
import { requireUser } from '@/lib/auth/page';
import { VersionView } from '@/components/correlation/version-view';

export async function generateMetadata({ params }: { params: Promise<{ slug: string; n: string }> }): Promise<Metadata> {
  const { slug, n } = await params;
  return { title: `${slug} v${n}` };
}

export default async function VersionPage({ params }: { params: Promise<{ slug: string; n: string }> }) {
  const { slug, n } = await params;
  const user = await requireUser();
  return <VersionView slug={slug} version={Number(n)} user={{ id: user.id, roles: user.roles }} />;
}
