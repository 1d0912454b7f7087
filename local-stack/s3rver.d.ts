// The parts of s3rver 3.7 (a Koa app; it ships no types) that the local fake uses.
declare module 's3rver' {
  namespace S3rver {
    /** The Koa request context, as far as the fake's own middleware reads and writes it. */
    interface Context {
      method: string;
      path: string;
      query: Record<string, string | string[] | undefined>;
      get(header: string): string;
      set(header: string, value: string): void;
      status: number;
      type: string;
      body: unknown;
    }
    type Middleware = (context: Context, next: () => Promise<void>) => Promise<void>;
    interface Options {
      address?: string;
      port?: number;
      silent?: boolean;
      directory?: string;
      configureBuckets?: Array<{ name: string }>;
    }
  }
  class S3rver {
    constructor(options: S3rver.Options);
    /** Koa's middleware list, composed when the server starts listening. */
    middleware: S3rver.Middleware[];
    run(): Promise<{ address: string; port: number }>;
    close(): Promise<void>;
  }
  export = S3rver;
}
