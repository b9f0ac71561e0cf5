import Link from 'next/link';
import { requireRole } from '@/lib/auth/page';

const TABS = [
  { href: '/admin/users', label: 'Users and roles' },
  { href: '/admin/tokens', label: 'API tokens' },
  { href: '/admin/audit', label: 'Audit trail' },
  { href: '/admin/mail', label: 'Sent mail' },
  { href: '/admin/evidence', label: 'Evidence policy' },
  { href: '/admin/webhooks', label: 'Webhook allow-list' },
  { href: '/admin/sign-in', label: 'Company sign-in' },
];

export default async function AdminLayout({ children }: { children: React.ReactNode }) {
  await requireRole(['admin']);
  return (
    <div className="space-y-4">
      <nav aria-label="Administration" className="flex gap-4 border-b border-line text-sm">
        {TABS.map((t) => <Link key={t.href} href={t.href} className="-mb-px border-b-2 border-transparent px-1 pb-2 text-ink-soft hover:border-brand hover:text-ink">{t.label}</Link>)}
      </nav>
      {children}
    </div>
  );
}
