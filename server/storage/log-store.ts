import type { Readable } from 'node:stream';

/**
 * The archive of round logs, behind one interface: a content-addressed folder on local disk
 * (`local-log-store.ts`) or an S3-compatible bucket (`s3-log-store.ts`), chosen by configuration
 * in `create-log-store.ts`. Every log is named by its SHA-256 and checked against it on each read.
 * Nothing outside server/storage knows which one is in use.
 */
export interface LogStore {
  /** Makes the store usable (its folder; its bucket, created when missing); `receive` waits for it too. Call on start to fail early. */
  prepare(): Promise<void>;
  /**
   * Streams a log in, taking its SHA-256 on the way, into a place of its own (never whole in
   * memory; with S3 never on local disk). Nothing is under the log's name until `keep()`. If the
   * source fails, nothing is left behind (with S3 the multipart upload is aborted) and this rejects.
   */
  receive(source: Readable): Promise<ReceivedLog>;
  /** The log's bytes, failing at the end (StoredLogCorruptError) if they do not hash to its name; StoredLogMissingError if there is none. */
  read(sha256: string): Readable;
  /** The stored size, or null when there is no such log. */
  stat(sha256: string): Promise<{ bytes: number } | null>;
  /**
   * Runs `use` with the path of a local file holding the log (the analysis engine reads byte
   * ranges of a real file). The local store hands over its own file; the S3 store downloads a copy
   * into `workFolder`, checking its SHA-256 on the way, and deletes it when `use` settles.
   * Callers still compare the hash the engine reports, which covers the local file too.
   */
  withLocalFile<T>(sha256: string, workFolder: string, use: (file: string) => Promise<T>): Promise<T>;
  /** Removes a log no database row refers to (cleanup after a failed transaction). */
  discard(sha256: string): Promise<void>;
}

/** A log streamed in and hashed, waiting to be kept under its name or dropped. */
export interface ReceivedLog {
  sha256: string;
  bytes: number;
  /** Stores it under its content address; `isNew` false when the same bytes were stored before. */
  keep(): Promise<{ isNew: boolean }>;
  /** Throws the received bytes away; does nothing after `keep()`. */
  drop(): Promise<void>;
}

/** Receives and keeps a log at once (seeders and tests; uploads keep only once the run is valid). */
export async function putLog(store: LogStore, source: Readable): Promise<{ sha256: string; bytes: number; isNew: boolean }> {
  const received = await store.receive(source);
  try {
    const { isNew } = await received.keep();
    return { sha256: received.sha256, bytes: received.bytes, isNew };
  } finally {
    await received.drop();
  }
}

/** There is no stored log of this name. */
export class StoredLogMissingError extends Error {
  constructor(readonly location: string) {
    super(`The stored log ${location} is missing.`);
    this.name = 'StoredLogMissingError';
  }
}

/** A stored log's bytes (or its recorded hash) do not match its name. */
export class StoredLogCorruptError extends Error {
  constructor(
    readonly location: string,
    readonly problem: string,
    /** What the bytes hash to, when they were read to the end. */
    readonly foundSha256?: string,
  ) {
    super(`The stored log ${location} fails its check: ${problem}.`);
    this.name = 'StoredLogCorruptError';
  }
}
