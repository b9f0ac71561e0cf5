// A local stand-in for the S3-compatible document store: s3rver on 127.0.0.1:$S3_PORT, objects kept in
// $S3_DIR (default .data/s3), the bucket $S3_BUCKET created at start. The app reaches it through the same
// S3 SDK (@aws-sdk/client-s3) it uses against a real store in production.
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
// s3rver ships no types.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const S3rver = require('s3rver') as new (o: Record<string, unknown>) => { run(): Promise<{ port: number }>; close(): Promise<void> };

const port = Number(process.env.S3_PORT ?? 4568);
const directory = process.env.S3_DIR ?? join(process.cwd(), '.data', 's3');
const bucket = process.env.S3_BUCKET ?? 'correlary-evidence';
mkdirSync(directory, { recursive: true });

const server = new S3rver({ address: '127.0.0.1', port, directory, silent: true, configureBuckets: [{ name: bucket, configs: [] }] });
server.run().then(() => console.log(`Fake S3 on 127.0.0.1:${port}, bucket ${bucket}, objects in ${directory}`), (err: Error) => { console.error(err); process.exit(1); });
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => { server.close().finally(() => process.exit(0)); });
