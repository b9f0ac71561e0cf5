import type { Metadata } from 'next';
import { ApiReference } from './api-reference';

export const metadata: Metadata = { title: 'API reference' };

export default function ApiReferencePage() {
  return <ApiReference />;
}
