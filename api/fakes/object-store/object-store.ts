import { mkdir } from 'node:fs/promises';
// s3rver: a local S3-compatible server from the npm registry (its types are in ./s3rver.d.ts).
import S3rver from 's3rver';

export interface ObjectStore {
  url: string;
  port: number;
  bucket: string;
  /** s3rver checks signatures against these (its documented fixed keys). */
  accessKeyId: string;
  secretAccessKey: string;
  close: () => Promise<void>;
}

/**
 * A local S3-compatible object store for `npm start` and the tests, so photos go through the
 * same SDK calls as against a real bucket. Data lives in `directory` (under .data/ for npm start).
 */
export async function startObjectStore(options: { port: number; directory: string; bucket: string; host?: string }): Promise<ObjectStore> {
  await mkdir(options.directory, { recursive: true });
  const server = new S3rver({
    address: options.host ?? '127.0.0.1',
    port: options.port,
    directory: options.directory,
    silent: true,
    vhostBuckets: false,
    configureBuckets: [{ name: options.bucket, configs: [] }],
  });
  const address = await server.run();
  return {
    url: `http://${options.host ?? '127.0.0.1'}:${address.port}`,
    port: address.port,
    bucket: options.bucket,
    accessKeyId: 'S3RVER',
    secretAccessKey: 'S3RVER',
    close: () => server.close(),
  };
}
