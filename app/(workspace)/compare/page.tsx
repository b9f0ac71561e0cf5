import type { Metadata } from 'next';
import { CompareView } from './compare-view';

export const metadata: Metadata = { title: 'Compare' };

export default function ComparePage() {
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-xl font-semibold">Compare correlations</h1>
        <p className="text-sm text-ink-soft">Pick correlations for one situation and plot them over a range of a common input; each one’s validity range is shaded.</p>
      </div>
      <CompareView />
    </div>
  );
}
