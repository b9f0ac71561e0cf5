import type { Metadata } from 'next';
import { requireUser } from '@/lib/auth/page';
import { WebhooksManager } from '@/components/webhooks-manager';

export const metadata: Metadata = { title: 'Webhooks' };

export default async function WebhooksPage() {
  await requireUser();
  return <WebhooksManager />;
}
