import type { Metadata } from 'next';
import { UsersAdmin } from './users-admin';

export const metadata: Metadata = { title: 'Users and roles' };

export default function UsersPage() {
  return <UsersAdmin />;
}
