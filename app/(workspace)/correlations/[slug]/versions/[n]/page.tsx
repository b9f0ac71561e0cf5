import type { Metadata } from 'next';
import { requireUser } from '@/lib/auth/page';
import { VersionView } from '@/components/correlation/version-view';

export async function generateMetadata({ params }: { params: Promise<{ slug: string; n: string }> }): Promise<Metadata> {
  const { slug, n } = await params;
  return { title: `${slug} v${n}` };
}

export default async function VersionPage({ params, searchParams }: { params: Promise<{ slug: string; n: string }>; searchParams: Promise<{ signed?: string }> }) {
  const { slug, n } = await params;
  const { signed } = await searchParams;
  const user = await requireUser();
  return (
    <>
      {(signed === 'approved' || signed === 'returned') && (
        <p role="status" className="mb-4 rounded bg-ok-bg px-3 py-2 text-sm text-ok">
          {signed === 'approved' ? `Version ${n} is approved with your signature; the previously approved version, if any, is now superseded.` : `Version ${n} went back to its author with your comment.`}
        </p>
      )}
      <VersionView slug={slug} version={Number(n)} user={{ id: user.id, roles: user.roles }} />
    </>
  );
}
