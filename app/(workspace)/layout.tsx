import Link from 'next/link';
import { requireUser } from '@/lib/auth/page';
import { Logo } from '@/components/ui/logo';
import { NavLinks, type NavItem } from '@/components/nav-links';
import { SignOutButton } from '@/components/sign-out-button';

export const dynamic = 'force-dynamic';

const NAV: NavItem[] = [
  { href: '/library', label: 'Library' },
  { href: '/compare', label: 'Compare' },
  { href: '/advisor', label: 'Which applies?' },
  { href: '/projects', label: 'Calculations' },
  { href: '/templates', label: 'Templates' },
  { href: '/author', label: 'My drafts', roles: ['author'] },
  { href: '/review', label: 'Review queue', roles: ['approver'] },
  { href: '/api-reference', label: 'API' },
  { href: '/admin/users', label: 'Admin', roles: ['admin'] },
];

export default async function WorkspaceLayout({ children }: { children: React.ReactNode }) {
  const user = await requireUser();
  const items = NAV.filter((n) => !n.roles || n.roles.some((r) => user.roles.includes(r)));
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-paper-raised focus:px-3 focus:py-2 focus:shadow">Skip to the content</a>
      <header className="border-b border-line bg-paper-raised">
        <div className="mx-auto flex max-w-7xl items-center gap-6 px-4 py-2.5">
          <Link href="/library" aria-label="Correlary home"><Logo /></Link>
          <NavLinks items={items} />
          <div className="ml-auto flex items-center gap-3 text-sm">
            <Link href="/account" className="text-ink-soft hover:text-ink" title={user.roles.join(', ')}>
              {user.name} <span className="text-ink-faint">· {user.roles.join(', ')}</span>
            </Link>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-7xl flex-1 px-4 py-6">{children}</main>
      <footer className="border-t border-line py-3 text-center text-xs text-ink-faint">
        Correlary — correlations with their sources, ranges and sign-offs.
      </footer>
    </div>
  );
}
