// Where uploaded files live. Default: a folder under .data (git-ignored). With STORAGE=s3, any
// S3-compatible store through the AWS SDK (STORAGE_S3_ENDPOINT, _BUCKET, _REGION, _KEY, _SECRET);
// the tests run it against a local fake.
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';

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
  const client = new S3Client({
    endpoint: options.endpoint,
    region: options.region ?? 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  return {
    async put(key, bytes, contentType) {
      await client.send(new PutObjectCommand({ Bucket: options.bucket, Key: key, Body: bytes, ContentType: contentType }));
    },
    async get(key) {
      const result = await client.send(new GetObjectCommand({ Bucket: options.bucket, Key: key }));
      return Buffer.from(await result.Body!.transformToByteArray());
    },
  };
}

export function storageFromEnv(env: NodeJS.ProcessEnv = process.env): Storage {
  if (env.STORAGE === 's3') {
    return s3Storage({
      endpoint: env.STORAGE_S3_ENDPOINT ?? 'http://127.0.0.1:9000',
      bucket: env.STORAGE_S3_BUCKET ?? 'hotwell',
      region: env.STORAGE_S3_REGION,
      accessKeyId: env.STORAGE_S3_KEY ?? 'local',
      secretAccessKey: env.STORAGE_S3_SECRET ?? 'local',
    });
  }
  return localStorage(env.STORAGE_DIR ?? path.resolve('.data', 'files'));
}
