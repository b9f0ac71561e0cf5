import { requireRole } from '@/lib/auth/page';

export default async function AuthorPage() {
  await requireRole(['author']);
  return <h1 className="text-xl font-semibold">My drafts</h1>;
}
