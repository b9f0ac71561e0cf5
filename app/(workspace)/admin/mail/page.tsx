import type { Metadata } from 'next';
import { MailView } from './mail-view';

export const metadata: Metadata = { title: 'Sent mail' };

export default function MailPage() {
  return <MailView />;
}
