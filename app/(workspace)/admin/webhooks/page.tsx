import type { Metadata } from 'next';
import { WebhookAllowlistForm } from './allowlist-form';

export const metadata: Metadata = { title: 'Webhook allow-list' };

export default function WebhookAllowlistPage() {
  return <WebhookAllowlistForm />;
}
