import { DeleteObjectsCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { env } from '@/lib/env';

/**
 * Object storage for evidence files: any S3-compatible service (S3_ENDPOINT, S3_BUCKET, S3_REGION,
 * keys); npm start/test run a local fake (scripts/s3-fake.ts). The browser sends and fetches
 * the bytes itself through short-lived presigned URLs; the server only checks and copies.
 * Checksums only when the service requires them: a presigned PUT must not carry the checksum of
 * an empty body.
 */
let client: S3Client | undefined;
function s3(): S3Client {
  client ??= new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  return client;
}

const Bucket = () => env.S3_BUCKET;
/** The origin the browser talks to for uploads and downloads (joins the CSP's connect-src and img/media-src). */
export const storageOrigin = () => new URL(env.S3_ENDPOINT).origin;

/** A PUT URL for exactly this size and type, valid for `seconds`. */
export async function presignPut(key: string, p: { size: number; contentType: string; seconds?: number }): Promise<string> {
  return getSignedUrl(s3(), new PutObjectCommand({ Bucket: Bucket(), Key: key, ContentLength: p.size, ContentType: p.contentType }), {
    expiresIn: p.seconds ?? 900,
    signableHeaders: new Set(['content-type', 'content-length']),
  });
}

/** A GET URL that answers with the given type and disposition, valid for `seconds`. */
export async function presignGet(key: string, p: { contentType: string; disposition: string; seconds?: number }): Promise<string> {
  return getSignedUrl(s3(), new GetObjectCommand({ Bucket: Bucket(), Key: key, ResponseContentType: p.contentType, ResponseContentDisposition: p.disposition }), {
    expiresIn: p.seconds ?? 120,
  });
}

/** The stored size in bytes, or null when there is no such object. */
export async function objectSize(key: string): Promise<number | null> {
  try {
    const h = await s3().send(new HeadObjectCommand({ Bucket: Bucket(), Key: key }));
    return Number(h.ContentLength ?? 0);
  } catch (err) {
    const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
    if (e.name === 'NotFound' || e.$metadata?.httpStatusCode === 404) return null;
    throw err;
  }
}

/** The first `n` bytes (or the whole object when n is omitted). */
export async function readObject(key: string, n?: number): Promise<Uint8Array> {
  const r = await s3().send(new GetObjectCommand({ Bucket: Bucket(), Key: key, Range: n ? `bytes=0-${n - 1}` : undefined }));
  return r.Body ? await r.Body.transformToByteArray() : new Uint8Array();
}

export async function putObject(key: string, body: Uint8Array, contentType: string): Promise<void> {
  await s3().send(new PutObjectCommand({ Bucket: Bucket(), Key: key, Body: body, ContentType: contentType }));
}

export async function deleteObjects(keys: (string | null | undefined)[]): Promise<void> {
  const list = keys.filter((k): k is string => !!k);
  if (!list.length) return;
  await s3().send(new DeleteObjectsCommand({ Bucket: Bucket(), Delete: { Objects: list.map((Key) => ({ Key })), Quiet: true } }));
}
