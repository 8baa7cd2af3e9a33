/**
 * The object store for private files: an S3 bucket through the AWS SDK, its endpoint, bucket and
 * credentials from the environment (in development and tests a local S3 fake on 127.0.0.1 with
 * path-style addressing). Files are never public: downloads go through a route that checks the
 * caller first.
 */
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { z } from 'zod';
import { HttpError } from '@/lib/api/errors';

const schema = z.object({
  /** e.g. http://127.0.0.1:4569 for the local fake; unset for the provider's own endpoint. */
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_BUCKET: z.string().min(3).default('needlemap-files'),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  /** "true" for stores addressed as endpoint/bucket/key (the local fake). */
  S3_FORCE_PATH_STYLE: z.enum(['true', 'false']).optional(),
});

export type StorageConfig = z.infer<typeof schema>;

/** The storage settings, validated once. */
export function storageConfig(env: NodeJS.ProcessEnv = process.env): StorageConfig {
  const parsed = schema.safeParse(env);
  if (!parsed.success) throw new Error(`Invalid storage settings: ${parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  return parsed.data;
}

export interface ObjectStore {
  put(key: string, body: Uint8Array, contentType: string): Promise<void>;
  get(key: string): Promise<Uint8Array>;
  delete(key: string): Promise<void>;
}

export const storageUnavailable = () =>
  new HttpError(503, 'File storage is unavailable for a moment. Nothing was saved; try again shortly.', { retryable: true });

/** An S3-backed store. */
export function s3Store(cfg: StorageConfig = storageConfig()): ObjectStore {
  const client = new S3Client({
    region: cfg.S3_REGION,
    ...(cfg.S3_ENDPOINT ? { endpoint: cfg.S3_ENDPOINT } : {}),
    forcePathStyle: cfg.S3_FORCE_PATH_STYLE === 'true',
    ...(cfg.S3_ACCESS_KEY_ID && cfg.S3_SECRET_ACCESS_KEY
      ? { credentials: { accessKeyId: cfg.S3_ACCESS_KEY_ID, secretAccessKey: cfg.S3_SECRET_ACCESS_KEY } }
      : {}),
    maxAttempts: 2,
  });
  const bucket = cfg.S3_BUCKET;
  const wrap = async <T>(fn: () => Promise<T>): Promise<T> => {
    try {
      return await fn();
    } catch (err) {
      const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
      if (e.name === 'NoSuchKey' || e.$metadata?.httpStatusCode === 404) throw new HttpError(404, 'That file is no longer stored.');
      console.error('Object store error', err);
      throw storageUnavailable();
    }
  };
  return {
    put: (key, body, contentType) =>
      wrap(async () => {
        await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.byteLength }));
      }),
    get: (key) =>
      wrap(async () => {
        const res = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
        if (!res.Body) throw new HttpError(404, 'That file is no longer stored.');
        return await res.Body.transformToByteArray();
      }),
    delete: (key) =>
      wrap(async () => {
        await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
      }),
  };
}

const globalStore = globalThis as unknown as { needlemapObjectStore?: ObjectStore };

/** The process's store (one client per server process). */
export function objectStore(): ObjectStore {
  globalStore.needlemapObjectStore ??= s3Store();
  return globalStore.needlemapObjectStore;
}
