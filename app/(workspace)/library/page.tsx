import type { Metadata } from 'next';
import { Suspense } from 'react';
import { LibraryTable } from './library-table';

export const metadata: Metadata = { title: 'Library' };

export default function LibraryPage() {
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-xl font-semibold">Correlation library</h1>
        <p className="text-sm text-ink-soft">Approved correlations with their validity ranges, sources and check cases. Drafts and versions in review show to their authors and to approvers.</p>
      </div>
      <Suspense fallback={<p className="text-sm text-ink-soft">Loading…</p>}><LibraryTable /></Suspense>
    </div>
  );
}
