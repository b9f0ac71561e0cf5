// Loads .env.local like the scripts do and points everything at the test database and server.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

const file = join(process.cwd(), '.env.local');
if (existsSync(file)) {
  for (const line of readFileSync(file, 'utf8').split('\n')) {
    const m = /^([A-Z0-9_]+)=(.*)$/.exec(line.trim());
    if (m && process.env[m[1]] === undefined) process.env[m[1]] = m[2].replace(/^"|"$/g, '');
  }
}
process.env.DB_NAME = process.env.DB_TEST_NAME ?? 'correlary_test';
process.env.TEST_BASE_URL ??= 'http://127.0.0.1:3100';
process.env.MAIL_DIR ??= join(process.cwd(), '.data', 'mail-test');
process.env.SMTP_PORT ??= '2526';
// The test run's own document store (scripts/test.sh starts it on this port with this bucket).
process.env.S3_ENDPOINT ??= `http://127.0.0.1:${process.env.TEST_S3_PORT ?? '4569'}`;
process.env.S3_BUCKET ??= 'correlary-evidence-test';
