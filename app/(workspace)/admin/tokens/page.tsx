import type { Metadata } from 'next';
import { TokenManager } from '@/components/token-manager';

export const metadata: Metadata = { title: 'API tokens' };

export default function AdminTokensPage() {
  return <TokenManager all />;
}
