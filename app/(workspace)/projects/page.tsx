import type { Metadata } from 'next';
import { requireUser } from '@/lib/auth/page';
import { ProjectList } from '@/components/calculation/project-list';

export const metadata: Metadata = { title: 'Calculations' };

export default async function ProjectsPage() {
  const user = await requireUser();
  return <ProjectList canCreate={user.roles.includes('engineer')} />;
}
