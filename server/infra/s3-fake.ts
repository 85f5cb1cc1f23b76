/**
 * A local S3-compatible object store (the s3rver package) for development and tests. The app
 * talks to it with the AWS S3 SDK exactly as it would to a hosted bucket.
 */
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import S3rver from 's3rver';

export interface S3Fake {
  endpoint: string;
  directory: string;
  close: () => Promise<void>;
}

export async function startS3Fake(opts: { directory: string; bucket: string; port?: number }): Promise<S3Fake> {
  fs.mkdirSync(opts.directory, { recursive: true });
  const server = new S3rver({
    address: '127.0.0.1',
    port: opts.port ?? 0,
    silent: true,
    directory: opts.directory,
    configureBuckets: [{ name: opts.bucket, configs: [] }],
  });
  const address = (await server.run()) as AddressInfo;
  return {
    endpoint: `http://127.0.0.1:${address.port}`,
    directory: opts.directory,
    close: () => server.close() as Promise<void>,
  };
}
