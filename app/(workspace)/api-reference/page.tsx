import type { Metadata } from 'next';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ApiReference } from './api-reference';

export const metadata: Metadata = { title: 'API reference' };

/** The typed client example shown on the page is the file the test suite runs (clients/typescript/evaluate.ts). */
export default function ApiReferencePage() {
  const example = readFileSync(join(process.cwd(), 'clients', 'typescript', 'evaluate.ts'), 'utf8');
  return <ApiReference typedExample={example} />;
}
