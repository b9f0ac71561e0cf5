import type { Metadata } from 'next';
import { EvidencePolicyForm } from './evidence-policy-form';

export const metadata: Metadata = { title: 'Evidence policy' };

export default function EvidencePolicyPage() {
  return <EvidencePolicyForm />;
}
