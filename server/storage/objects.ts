// Object storage through the S3 API: the same code talks to the local fake (server/fakes.ts) in development
// and tests and to real object storage in production (endpoint, bucket and credentials from the environment).
import { HttpError } from '../errors';
import { DeleteObjectsCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';

export type StorageConfig = { endpoint?: string; region: string; bucket: string; accessKeyId: string; secretAccessKey: string; forcePathStyle: boolean };

/** From S3_* variables, with the local fake's defaults (its well-known test credentials). */
export function storageConfigFromEnv(env = process.env, local?: { endpoint: string; bucket: string }): StorageConfig {
  return {
    endpoint: env.S3_ENDPOINT ?? local?.endpoint,
    region: env.S3_REGION ?? 'us-east-1',
    bucket: env.S3_BUCKET ?? local?.bucket ?? 'falloff-photos',
    accessKeyId: env.S3_ACCESS_KEY_ID ?? 'S3RVER',
    secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? 'S3RVER',
    // A custom endpoint (the fake, most self-hosted stores) wants bucket-in-path URLs.
    forcePathStyle: env.S3_FORCE_PATH_STYLE ? env.S3_FORCE_PATH_STYLE === '1' : Boolean(env.S3_ENDPOINT ?? local?.endpoint),
  };
}

export type ObjectStore = ReturnType<typeof createObjectStore>;

/** Every call to object storage ends within this long (connect, send and read the whole body). */
export const S3_TIMEOUT_MS = Number(process.env.S3_TIMEOUT_MS ?? 8000);

/** Storage that does not answer in time (or not at all) is a 503 the client may retry, never a hang or a 500. */
function unavailable(err: unknown): never {
  if ((err as { name?: string }).name === 'NoSuchKey') throw err;
  throw new HttpError(503, 'storage_unavailable', 'photo storage is not answering; try again in a minute', { retryAfterS: 30 });
}

export function createObjectStore(c: StorageConfig) {
  // The pinned SDK runs on this project's Node 20; its start-up notice is about releases after January 2027,
  // which package.json does not take. Printed on every start, it would bury npm start's own lines.
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';
  const s3 = new S3Client({
    endpoint: c.endpoint,
    region: c.region,
    forcePathStyle: c.forcePathStyle,
    credentials: { accessKeyId: c.accessKeyId, secretAccessKey: c.secretAccessKey },
    requestHandler: { connectionTimeout: Math.min(3000, S3_TIMEOUT_MS), requestTimeout: S3_TIMEOUT_MS },
    maxAttempts: 2,
    // Checksums only where the API requires them: not every S3-compatible store speaks the newer ones.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = c.bucket;
  /** One call with a deadline over the whole of it, retries included. */
  const send = <T>(run: (abortSignal: AbortSignal) => Promise<T>): Promise<T> => run(AbortSignal.timeout(S3_TIMEOUT_MS)).catch(unavailable);
  return {
    bucket: Bucket,
    async put(key: string, body: Buffer, contentType: string) {
      await send((abortSignal) => s3.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.length }), { abortSignal }));
    },
    /** The object's bytes, or null when there is none by that key. */
    async get(key: string): Promise<Buffer | null> {
      try {
        return await send(async (abortSignal) => {
          const r = await s3.send(new GetObjectCommand({ Bucket, Key: key }), { abortSignal });
          return Buffer.from(await r.Body!.transformToByteArray());
        });
      } catch (err) {
        if ((err as { name?: string }).name === 'NoSuchKey') return null;
        throw err;
      }
    },
    async remove(keys: string[]) {
      if (keys.length) await send((abortSignal) => s3.send(new DeleteObjectsCommand({ Bucket, Delete: { Objects: keys.map((Key) => ({ Key })), Quiet: true } }), { abortSignal }));
    },
    /** Keys under a prefix (tests check that a refused upload stored nothing). */
    async list(prefix: string): Promise<string[]> {
      const r = await send((abortSignal) => s3.send(new ListObjectsV2Command({ Bucket, Prefix: prefix }), { abortSignal }));
      return (r.Contents ?? []).map((o) => o.Key!).filter(Boolean);
    },
    close: () => s3.destroy(),
  };
}
