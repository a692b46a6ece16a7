// Where uploaded files live. Default: a folder under .data (git-ignored). With STORAGE=s3, any
// S3-compatible store through the AWS SDK (STORAGE_S3_ENDPOINT, _BUCKET, _REGION, _KEY, _SECRET);
// the tests run it against a local fake. The SDK is large: it is loaded only when S3 is configured.
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { StorageConfig } from '../config';

export type Storage = {
  put(key: string, bytes: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer>;
};

export function localStorage(root: string): Storage {
  const file = (key: string) => {
    const resolved = path.resolve(root, key);
    if (!resolved.startsWith(path.resolve(root) + path.sep)) throw new Error('storage key escapes the folder');
    return resolved;
  };
  return {
    async put(key, bytes) {
      await mkdir(path.dirname(file(key)), { recursive: true });
      await writeFile(file(key), bytes);
    },
    get: (key) => readFile(file(key)),
  };
}

export function s3Storage(options: { endpoint: string; bucket: string; region?: string; accessKeyId: string; secretAccessKey: string }): Storage {
  // Loading starts now (at start-up, when S3 is configured), so the first upload does not wait for it.
  const ready = import('@aws-sdk/client-s3').then((sdk) => ({
    sdk,
    client: new sdk.S3Client({
      endpoint: options.endpoint,
      region: options.region ?? 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey },
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    }),
  }));
  // A failed load is reported by the first put/get, not as an unhandled rejection at start.
  ready.catch(() => {});
  return {
    async put(key, bytes, contentType) {
      const { sdk, client } = await ready;
      await client.send(new sdk.PutObjectCommand({ Bucket: options.bucket, Key: key, Body: bytes, ContentType: contentType }));
    },
    async get(key) {
      const { sdk, client } = await ready;
      const result = await client.send(new sdk.GetObjectCommand({ Bucket: options.bucket, Key: key }));
      return Buffer.from(await result.Body!.transformToByteArray());
    },
  };
}

/** The store the configuration names (local files unless STORAGE=s3). */
export function storageFor(config: StorageConfig = { kind: 'local', dir: path.resolve('.data', 'files') }): Storage {
  return config.kind === 's3' ? s3Storage(config) : localStorage(config.dir);
}
