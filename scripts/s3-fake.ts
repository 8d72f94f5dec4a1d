/**
 * A local S3-compatible object store for development and tests (s3rver), started by npm start and
 * npm test like the mail catcher. Data lives in S3_FAKE_DIR (default .data/s3). The bucket
 * S3_BUCKET is created with a CORS rule that lets the app's pages (APP_URL, TRUSTED_ORIGINS) PUT
 * and GET directly. A real bucket needs none of this: set S3_ENDPOINT, S3_BUCKET, S3_REGION and
 * the keys, and give the bucket the same CORS rule.
 * Env: S3_FAKE_PORT (4569), S3_FAKE_DIR, S3_BUCKET, APP_URL, TRUSTED_ORIGINS.
 */
import S3rver from 's3rver';
import { mkdirSync } from 'node:fs';
import { resolve } from 'node:path';

const port = Number(process.env.S3_FAKE_PORT ?? 4569);
const directory = resolve(process.env.S3_FAKE_DIR ?? '.data/s3');
const bucket = process.env.S3_BUCKET ?? 'quietfix-evidence';
const origins = [process.env.APP_URL ?? 'http://localhost:3000', ...(process.env.TRUSTED_ORIGINS ?? '').split(',')]
  .map((o) => o.trim())
  .filter(Boolean)
  .map((o) => new URL(o).origin);

const cors = `<CORSConfiguration>
  <CORSRule>
    ${origins.map((o) => `<AllowedOrigin>${o}</AllowedOrigin>`).join('\n    ')}
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>600</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

mkdirSync(directory, { recursive: true });
const server = new S3rver({ port, address: '127.0.0.1', directory, silent: true, configureBuckets: [{ name: bucket, configs: [cors] }] });
server.run().then(
  () => console.log(`quietfix s3 fake on http://127.0.0.1:${port} (bucket ${bucket}, data in ${directory})`),
  (err: Error) => {
    console.error(`the s3 fake could not start: ${err.message}`);
    process.exit(1);
  },
);
for (const sig of ['SIGINT', 'SIGTERM'] as const) process.on(sig, () => server.close().finally(() => process.exit(0)));
