import { S3Client } from '@aws-sdk/client-s3';
import type { S3StorageConfig } from '../config/config';

// The SDK is pinned to a line that runs on Node 20 (package.json); its notice that later lines
// will need Node 22 would otherwise print from every process that opens a client.
process.env['AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED'] ??= 'true';

/**
 * An S3 client for any S3-compatible server: path-style addresses (`endpoint/bucket/key`, which
 * MinIO, Ceph and the local fake need and AWS accepts), and checksums only where an operation
 * requires one: the SDK's default CRC32 trailers and `aws-chunked` bodies are not understood by
 * every S3-compatible server, and each log is checked against its SHA-256 by the store anyway.
 * Credentials: the configured pair, else the SDK's own chain (environment, profile, instance role).
 */
export function createS3Client(config: S3StorageConfig & { endpoint: string }): S3Client {
  return new S3Client({
    endpoint: config.endpoint,
    region: config.region,
    forcePathStyle: true,
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    ...(config.credentials ? { credentials: config.credentials } : {}),
  });
}

/** Whether an SDK error says the bucket or object is not there. */
export function isNotFound(error: unknown): boolean {
  const failure = error as { name?: string; $metadata?: { httpStatusCode?: number } };
  return failure.name === 'NotFound' || failure.name === 'NoSuchKey' || failure.name === 'NoSuchBucket' || failure.$metadata?.httpStatusCode === 404;
}
