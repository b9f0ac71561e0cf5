import { GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { AppError } from '@/lib/http/errors';

/**
 * Object storage for evidence documents, through the S3 SDK. Production points these settings at any
 * S3-compatible store; the demo and the tests run a local stand-in (scripts/fake-s3.ts) on loopback.
 *   S3_ENDPOINT (e.g. http://127.0.0.1:4568; empty for AWS itself), S3_REGION, S3_BUCKET,
 *   S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY, S3_FORCE_PATH_STYLE (true for most self-hosted stores).
 */
export function storageSettings() {
  return {
    endpoint: process.env.S3_ENDPOINT || undefined,
    region: process.env.S3_REGION || 'us-east-1',
    bucket: process.env.S3_BUCKET || 'correlary-evidence',
    accessKeyId: process.env.S3_ACCESS_KEY_ID || 'S3RVER',
    secretAccessKey: process.env.S3_SECRET_ACCESS_KEY || 'S3RVER',
    forcePathStyle: (process.env.S3_FORCE_PATH_STYLE ?? 'true') !== 'false',
  };
}

let client: S3Client | null = null;
let clientKey = '';

function s3(): { client: S3Client; bucket: string } {
  const s = storageSettings();
  const key = JSON.stringify(s);
  if (!client || key !== clientKey) {
    client = new S3Client({
      endpoint: s.endpoint, region: s.region, forcePathStyle: s.forcePathStyle,
      credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey },
      // A hung store must not hold a request: bounded attempts and time.
      maxAttempts: 2, requestHandler: { requestTimeout: 15_000, connectionTimeout: 3_000 },
    });
    clientKey = key;
  }
  return { client, bucket: s.bucket };
}

function unavailable(err: unknown): never {
  console.error('object storage unavailable:', (err as Error)?.message ?? err);
  throw new AppError('unavailable:storage', 'The document store is not reachable just now; nothing was changed. Retry in a few seconds.', undefined, { 'Retry-After': '5' });
}

export async function putObject(key: string, body: Uint8Array, mediaType: string): Promise<void> {
  const { client, bucket } = s3();
  try {
    await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: mediaType, ContentLength: body.byteLength }));
  } catch (err) { unavailable(err); }
}

/** The object's bytes, or null when the store does not hold it. */
export async function getObject(key: string): Promise<Uint8Array | null> {
  const { client, bucket } = s3();
  try {
    const answer = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
    return answer.Body ? await answer.Body.transformToByteArray() : new Uint8Array();
  } catch (err) {
    const name = (err as { name?: string })?.name;
    if (name === 'NoSuchKey' || name === 'NotFound') return null;
    unavailable(err);
  }
}

/** Whether the bucket answers (readiness). */
export async function storageReachable(): Promise<boolean> {
  const { client, bucket } = s3();
  try { await client.send(new HeadBucketCommand({ Bucket: bucket })); return true; } catch { return false; }
}
