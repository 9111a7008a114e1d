import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';

/**
 * Where photo bytes live. The API stays stateless: a cloud bucket driver can replace the disk one
 * without touching the callers. Keys are always chosen by the server, never by the client.
 */
export abstract class PhotoStorage {
  abstract put(key: string, bytes: Buffer): Promise<void>;
  abstract get(key: string): Promise<Buffer>;
  abstract remove(key: string): Promise<void>;
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
}
