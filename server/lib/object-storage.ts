// The SDK warns that releases after January 2027 need Node 22; DEVELOPERS.md records the plan.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';

import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { Readable } from 'node:stream';

export interface ObjectStorage {
  put: (key: string, body: Buffer, contentType: string) => Promise<void>;
  get: (key: string) => Promise<{ body: Readable; contentType: string | undefined; size: number | undefined }>;
  remove: (key: string) => Promise<void>;
}

export function createObjectStorage(cfg: { endpoint?: string; bucket: string; region: string; accessKeyId: string; secretAccessKey: string }): ObjectStorage {
  const client = new S3Client({
    region: cfg.region,
    endpoint: cfg.endpoint,
    forcePathStyle: Boolean(cfg.endpoint),
    credentials: { accessKeyId: cfg.accessKeyId, secretAccessKey: cfg.secretAccessKey },
    // Plain PUTs: some S3-compatible stores do not understand the SDK's default trailing checksums.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  return {
    async put(key, body, contentType) {
      await client.send(new PutObjectCommand({ Bucket: cfg.bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.length }));
    },
    async get(key) {
      const out = await client.send(new GetObjectCommand({ Bucket: cfg.bucket, Key: key }));
      return { body: out.Body as Readable, contentType: out.ContentType, size: out.ContentLength };
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket: cfg.bucket, Key: key }));
    },
  };
}
