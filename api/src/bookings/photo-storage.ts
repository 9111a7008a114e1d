import { access, mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import { DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import path from 'node:path';

/**
 * Where photo bytes live. The API stays stateless: a cloud bucket driver can replace the disk one
 * without touching the callers. Keys are always chosen by the server, never by the client.
 */
export abstract class PhotoStorage {
  abstract put(key: string, bytes: Buffer): Promise<void>;
  abstract get(key: string): Promise<Buffer>;
  abstract remove(key: string): Promise<void>;
  /** Whether the store answers now (readiness). */
  abstract isReachable(timeoutMs?: number): Promise<boolean>;
}

const safeKey = /^[0-9a-f-]{36}\/[0-9a-f-]{36}(\.thumb)?\.[a-z0-9]{2,5}$/;

export class LocalDiskPhotoStorage extends PhotoStorage {
  constructor(private readonly root: string) {
    super();
  }

  private pathOf(key: string): string {
    // Keys come from the server, but the check keeps a bad one from ever leaving the root.
    if (!safeKey.test(key)) throw new Error(`refusing storage key ${JSON.stringify(key)}`);
    return path.join(path.resolve(this.root), key);
  }

  async put(key: string, bytes: Buffer): Promise<void> {
    const file = this.pathOf(key);
    await mkdir(path.dirname(file), { recursive: true });
    await writeFile(file, bytes, { flag: 'wx' });
  }

  get(key: string): Promise<Buffer> {
    return readFile(this.pathOf(key));
  }

  async remove(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async isReachable(): Promise<boolean> {
    try {
      await mkdir(path.resolve(this.root), { recursive: true });
      await access(path.resolve(this.root));
      return true;
    } catch {
      return false;
    }
  }
}

/** The content type a stored key's extension stands for (keys are server-chosen: jpg, png, webp); the backup reads it too. */
export function contentTypeOfKey(key: string): string {
  const ext = key.slice(key.lastIndexOf('.') + 1);
  return (
    ({ jpg: 'image/jpeg', jpeg: 'image/jpeg', png: 'image/png', webp: 'image/webp' } as Record<string, string>)[ext] ??
    'application/octet-stream'
  );
}

export interface S3Settings {
  bucket: string;
  /** Unset: the provider's own endpoint for the region. Any S3-compatible store: its URL. */
  endpoint?: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** bucket in the path (http://host/bucket/key) rather than the host name; most S3-compatible stores want it. */
  forcePathStyle: boolean;
}

/** The S3 client for the API and for `npm run backup` / `npm run restore` (backup-common.mjs loads it from the build). */
export function s3ClientFor(settings: S3Settings): S3Client {
  return new S3Client({
    region: settings.region,
    endpoint: settings.endpoint,
    forcePathStyle: settings.forcePathStyle,
    credentials:
      settings.accessKeyId && settings.secretAccessKey
        ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey }
        : undefined,
    // Checksums only where the S3 API requires them: many S3-compatible stores do not know the
    // newer flexible-checksum headers the SDK would otherwise add to every upload.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 3,
  });
}

/**
 * Photos in one S3-compatible bucket through the official SDK, so any number of API replicas
 * read and write the same photos. The bucket stays private: photos reach people only through
 * the API's authorised routes.
 */
export class S3PhotoStorage extends PhotoStorage {
  constructor(
    readonly client: S3Client,
    readonly bucket: string,
  ) {
    super();
  }

  async put(key: string, bytes: Buffer): Promise<void> {
    if (!safeKey.test(key)) throw new Error(`refusing storage key ${JSON.stringify(key)}`);
    await this.client.send(
      new PutObjectCommand({ Bucket: this.bucket, Key: key, Body: bytes, ContentType: contentTypeOfKey(key), ContentLength: bytes.length }),
    );
  }

  async get(key: string): Promise<Buffer> {
    const answer = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
    return Buffer.from(await answer.Body!.transformToByteArray());
  }

  async remove(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key }));
  }

  override async isReachable(timeoutMs = 2_000): Promise<boolean> {
    try {
      await this.client.send(new HeadBucketCommand({ Bucket: this.bucket }), { abortSignal: AbortSignal.timeout(timeoutMs) });
      return true;
    } catch {
      return false;
    }
  }
}
