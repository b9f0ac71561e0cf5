import type { Metadata } from 'next';
import { requireRole } from '@/lib/auth/page';
import { AuthorHome } from './author-home';

export const metadata: Metadata = { title: 'My drafts' };

export default async function AuthorPage() {
  await requireRole(['author']);
  return (
    <div className="space-y-4">
      <h1 className="text-xl font-semibold">My drafts</h1>
      <AuthorHome />
    </div>
  );
}
