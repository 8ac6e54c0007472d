// The few parts of s3rver (which ships no types) that scripts/s3-server.ts and the tests use.
declare module "s3rver" {
  type Options = {
    address?: string;
    port?: number;
    directory: string;
    silent?: boolean;
    resetOnClose?: boolean;
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[];
  };
  export default class S3rver {
    constructor(options: Options);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
}
