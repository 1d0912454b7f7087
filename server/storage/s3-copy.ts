import {
  AbortMultipartUploadCommand,
  CompleteMultipartUploadCommand,
  CopyObjectCommand,
  CreateMultipartUploadCommand,
  UploadPartCopyCommand,
  type S3Client,
} from '@aws-sdk/client-s3';

/** How objects are copied inside a bucket: S3's CopyObject takes at most 5 GiB in one request. */
export interface CopyLimits {
  /** Largest object copied with one CopyObject; larger ones are copied part by part. */
  singleCopyMaxBytes: number;
  /** Size of each part of a multipart copy (S3: 5 MiB to 5 GiB). */
  partBytes: number;
}

export const S3_COPY_LIMITS: CopyLimits = { singleCopyMaxBytes: 5 * 1024 ** 3, partBytes: 512 * 1024 ** 2 };

/**
 * Copies an object to another key of the same bucket with new metadata, server-side: one
 * CopyObject up to the single-copy limit, else a multipart upload of UploadPartCopy ranges, which
 * is aborted (leaving no parts) when a step fails.
 */
export async function copyWithin(
  client: S3Client,
  bucket: string,
  copy: { from: string; to: string; bytes: number; metadata: Record<string, string> },
  limits: CopyLimits,
): Promise<void> {
  const { from, to, bytes, metadata } = copy;
  const source = `${bucket}/${from}`;
  if (bytes <= limits.singleCopyMaxBytes) {
    await client.send(new CopyObjectCommand({ Bucket: bucket, Key: to, CopySource: source, MetadataDirective: 'REPLACE', Metadata: metadata }));
    return;
  }
  const { UploadId } = await client.send(new CreateMultipartUploadCommand({ Bucket: bucket, Key: to, Metadata: metadata }));
  try {
    const parts: Array<{ PartNumber: number; ETag?: string }> = [];
    for (let start = 0; start < bytes; start += limits.partBytes) {
      const end = Math.min(start + limits.partBytes, bytes) - 1;
      const PartNumber = parts.length + 1;
      const { CopyPartResult } = await client.send(
        new UploadPartCopyCommand({ Bucket: bucket, Key: to, UploadId, PartNumber, CopySource: source, CopySourceRange: `bytes=${start}-${end}` }),
      );
      parts.push({ PartNumber, ETag: CopyPartResult?.ETag });
    }
    await client.send(new CompleteMultipartUploadCommand({ Bucket: bucket, Key: to, UploadId, MultipartUpload: { Parts: parts } }));
  } catch (error) {
    await client.send(new AbortMultipartUploadCommand({ Bucket: bucket, Key: to, UploadId })).catch(() => undefined);
    throw error;
  }
}
