import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/page';
import { UsersAdmin } from './users-admin';

export const metadata: Metadata = { title: 'Users and roles' };

export default async function UsersPage() {
  const me = await requireRole(['admin']);
  return <UsersAdmin meId={me.id} />;
}
