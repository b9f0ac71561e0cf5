import { notFound, redirect } from 'next/navigation';
import { requireUser } from '@/lib/auth/page';
import { getCorrelation } from '@/lib/governance/queries';
import { AppError } from '@/lib/http/errors';

/** A correlation's address opens its approved version, else the newest version the user may see. */
export default async function CorrelationPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const user = await requireUser();
  let target: number;
  try {
    const c = await getCorrelation({ actor: user, slug });
    target = c.latestApprovedVersion ?? c.versions[0].version;
  } catch (err) {
    if (err instanceof AppError && err.code.startsWith('not_found')) notFound();
    throw err;
  }
  redirect(`/correlations/${slug}/versions/${target}`);
}
