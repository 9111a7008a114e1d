// s3rver ships no type declarations; these cover the part the local object store uses.
declare module 's3rver' {
  import type { AddressInfo } from 'node:net';

  export default class S3rver {
    constructor(options: Record<string, unknown>);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
}
