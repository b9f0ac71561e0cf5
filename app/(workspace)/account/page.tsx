import type { Metadata } from 'next';
import Link from 'next/link';
import { requireUser } from '@/lib/auth/page';
import { PasswordForm } from './password-form';
import { MyTokens } from './my-tokens';
import { EndSessions } from './end-sessions';

export const metadata: Metadata = { title: 'Account' };

export default async function AccountPage() {
  const user = await requireUser();
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <section className="panel space-y-1">
        <h1 className="text-lg font-semibold">{user.name}</h1>
        <p className="text-sm text-ink-soft">{user.email}</p>
        <p className="text-sm">Roles: {user.roles.join(', ')}</p>
        <div className="pt-4"><PasswordForm /></div>
        <div className="pt-4"><EndSessions /></div>
      </section>
      <div className="space-y-4">
        <MyTokens />
        <p className="panel text-sm">Systems that depend on a correlation version can be told when it changes: <Link href="/account/webhooks" className="text-brand-dark underline">webhooks</Link>.</p>
      </div>
    </div>
  );
}
