// @20minutes/s3rver ships no types; this is the part of its API server/fakes.ts uses.
declare module '@20minutes/s3rver' {
  import type { AddressInfo } from 'node:net';
  type Options = { address?: string; port?: number; silent?: boolean; directory?: string; resetOnClose?: boolean; allowMismatchedSignatures?: boolean; configureBuckets?: { name: string; configs: unknown[] }[] };
  class S3rver {
    constructor(options?: Options);
    run(): Promise<AddressInfo>;
    close(): Promise<void>;
  }
  export = S3rver;
}
