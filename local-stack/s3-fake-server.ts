import fs from 'node:fs';
import S3rver from 's3rver';
import { missingOperations } from './s3-fake-operations';

/**
 * The local fake S3 server as a process of its own (started by `startS3Fake`): s3rver on
 * 127.0.0.1 with its objects under a folder, the bucket made at start, and the operations it
 * lacks added. Arguments: port, folder, bucket. Prints `listening` once it answers.
 */
async function main(): Promise<void> {
  const [port, folder, bucket] = process.argv.slice(2);
  fs.mkdirSync(folder, { recursive: true });
  const fake = new S3rver({ address: '127.0.0.1', port: Number(port), silent: true, directory: folder, configureBuckets: [{ name: bucket }] });
  fake.middleware.unshift(missingOperations(folder));
  await fake.run();
  process.stdout.write('listening\n');
  const stop = () => void fake.close().finally(() => process.exit(0));
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);
}

main().catch((error: unknown) => {
  process.stderr.write(`${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
});
