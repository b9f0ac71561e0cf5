'use client';

import { TokenManager } from '@/components/token-manager';

export function MyTokens() {
  return <TokenManager />;
}
