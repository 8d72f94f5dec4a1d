/** The part of s3rver 3.7 that scripts/s3-fake.ts uses (the package ships no types). */
declare module 's3rver' {
  type Options = {
    port?: number;
    address?: string;
    directory?: string;
    silent?: boolean;
    configureBuckets?: { name: string; configs: (string | Buffer)[] }[];
  };
  export default class S3rver {
    constructor(options: Options);
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
}
