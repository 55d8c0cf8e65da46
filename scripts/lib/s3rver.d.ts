// s3rver ships no types; these are the parts the test harness calls.
declare module 's3rver' {
  interface S3rverOptions {
    address?: string;
    port?: number;
    directory?: string;
    silent?: boolean;
    configureBuckets?: Array<{ name: string }>;
  }
  export default class S3rver {
    constructor(options: S3rverOptions);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
}
