'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';

export interface NavItem {
  href: string;
  label: string;
  roles?: ('admin' | 'author' | 'approver' | 'engineer' | 'integrator')[];
}

export function NavLinks({ items }: { items: NavItem[] }) {
  const path = usePathname();
  return (
    <nav aria-label="Main" className="flex items-center gap-1 text-sm">
      {items.map((item) => {
        const active = path === item.href || path.startsWith(`${item.href.split('/').slice(0, 2).join('/')}/`);
        return (
          <Link key={item.href} href={item.href} aria-current={active ? 'page' : undefined}
            className={`rounded px-2.5 py-1.5 ${active ? 'bg-brand-light font-medium text-brand-dark' : 'text-ink-soft hover:bg-paper-sunk hover:text-ink'}`}>
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
