const STYLES: Record<string, string> = {
  draft: 'bg-paper-sunk text-ink-soft border-line',
  in_review: 'bg-brand-light text-brand-dark border-brand/30',
  approved: 'bg-ok-bg text-ok border-ok/30',
  superseded: 'bg-paper-sunk text-ink-faint border-line',
  returned: 'bg-caution-bg text-caution border-caution-line',
  withdrawn: 'bg-danger-bg text-danger border-danger/30',
};

const LABELS: Record<string, string> = { in_review: 'in review' };

export function StatusBadge({ status }: { status: string }) {
  return (
    <span className={`inline-block rounded-full border px-2 py-0.5 text-xs font-medium ${STYLES[status] ?? STYLES.draft}`}>
      {LABELS[status] ?? status}
    </span>
  );
}
