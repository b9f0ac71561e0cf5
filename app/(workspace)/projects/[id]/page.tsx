import type { Metadata } from 'next';
import { requireUser } from '@/lib/auth/page';
import { ProjectView } from '@/components/calculation/project-view';

export const metadata: Metadata = { title: 'Project' };

export default async function ProjectPage({ params }: { params: Promise<{ id: string }> }) {
  await requireUser();
  return <ProjectView id={Number((await params).id)} />;
}
