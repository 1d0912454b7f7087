import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type S3rver from 's3rver';

/*
 * s3rver 3.7 lacks three operations Bellkeep's S3 store relies on, so the local fake adds them
 * over s3rver's own files (`<bucket>/._S3rver_uploads/<uploadId>/` holds a multipart upload: its
 * `key`, `metadata`, and each part as `<n>` with `<n>.md5`; an object is `<key>._S3rver_object`):
 * - AbortMultipartUpload (lib-storage sends it when an upload fails): removes the upload's parts;
 * - ListMultipartUploads: lists the uploads neither completed nor aborted;
 * - UploadPartCopy: copies a byte range of an object into a part (the copy of logs over 5 GiB).
 * They run before s3rver's own routes and, like the fake as a whole, trust any caller on loopback.
 */
export function missingOperations(folder: string): S3rver.Middleware {
  const inFolder = (...parts: string[]) => {
    const resolved = path.resolve(folder, ...parts);
    if (!resolved.startsWith(path.resolve(folder) + path.sep)) throw new Error(`Outside the fake's folder: ${parts.join('/')}`);
    return resolved;
  };
  const uploadsOf = (bucket: string) => inFolder(bucket, '._S3rver_uploads');
  const xml = (context: S3rver.Context, body: string) => {
    context.type = 'application/xml';
    context.body = `<?xml version="1.0" encoding="UTF-8"?>\n${body}`;
  };

  return async (context, next) => {
    const [, bucket, key] = /^\/([^/]+)(?:\/(.*))?$/.exec(context.path) ?? [];
    const uploadId = typeof context.query['uploadId'] === 'string' ? context.query['uploadId'] : undefined;
    if (!bucket || (uploadId !== undefined && !/^[0-9a-f]{32}$/.test(uploadId))) return next();

    if (context.method === 'DELETE' && key && uploadId) {
      await fs.promises.rm(path.join(uploadsOf(bucket), uploadId), { recursive: true, force: true });
      context.status = 204;
      return;
    }

    if (context.method === 'GET' && !key && 'uploads' in context.query) {
      const ids = await fs.promises.readdir(uploadsOf(bucket)).catch(() => [] as string[]);
      const uploads = await Promise.all(
        ids.map(async (id) => `<Upload><Key>${escapeXml(await fs.promises.readFile(path.join(uploadsOf(bucket), id, 'key'), 'utf8'))}</Key><UploadId>${id}</UploadId></Upload>`),
      );
      return xml(context, `<ListMultipartUploadsResult><Bucket>${escapeXml(bucket)}</Bucket><IsTruncated>false</IsTruncated>${uploads.join('')}</ListMultipartUploadsResult>`);
    }

    const copySource = context.get('x-amz-copy-source');
    const partNumber = Number(context.query['partNumber']);
    if (context.method === 'PUT' && key && uploadId && copySource && Number.isInteger(partNumber) && partNumber >= 1) {
      const [, sourceBucket, sourceKey] = /^\/?([^/]+)\/(.+)$/.exec(decodeURIComponent(copySource)) ?? [];
      const range = /^bytes=(\d+)-(\d+)$/.exec(context.get('x-amz-copy-source-range'));
      if (!sourceBucket || !sourceKey || !range) return next();
      const part = path.join(uploadsOf(bucket), uploadId, String(partNumber));
      const md5 = crypto.createHash('md5');
      await pipeline(
        fs.createReadStream(inFolder(sourceBucket, `${sourceKey}._S3rver_object`), { start: Number(range[1]), end: Number(range[2]) }),
        async function* (chunks: AsyncIterable<Buffer>) {
          for await (const chunk of chunks) {
            md5.update(chunk);
            yield chunk;
          }
        },
        fs.createWriteStream(part),
      );
      const etag = md5.digest('hex');
      await fs.promises.writeFile(`${part}.md5`, etag);
      return xml(context, `<CopyPartResult><ETag>"${etag}"</ETag><LastModified>${new Date().toISOString()}</LastModified></CopyPartResult>`);
    }
    return next();
  };
}

function escapeXml(text: string): string {
  return text.replace(/[<>&'"]/g, (character) => `&#${character.charCodeAt(0)};`);
}
