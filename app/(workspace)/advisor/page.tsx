import type { Metadata } from 'next';
import { Suspense } from 'react';
import { AdvisorWorkspace } from '@/components/advisor/advisor-workspace';

export const metadata: Metadata = { title: 'Which correlation applies?' };

export default function AdvisorPage() {
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-xl font-semibold">Which correlation applies?</h1>
        <p className="text-sm text-ink-soft">
          Every approved correlation for a situation at your point: whether the point lies inside its validity ranges (and how far outside if not),
          its value, its stated band and its evidence grade, the spread between them, and a plot over one input with each range drawn.
        </p>
      </div>
      <Suspense><AdvisorWorkspace /></Suspense>
    </div>
  );
}
