// The part of s3rver (the local fake S3 server; it ships no types) that fake-s3.ts uses.
declare module 's3rver' {
  interface S3rverOptions {
    address?: string;
    port?: number;
    directory?: string;
    silent?: boolean;
    resetOnClose?: boolean;
    allowMismatchedSignatures?: boolean;
    vhostBuckets?: boolean;
    configureBuckets?: Array<{ name: string }>;
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; family: string; port: number }>;
    close(): Promise<void>;
  }
}
