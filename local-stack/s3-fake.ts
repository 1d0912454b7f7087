import { spawn } from 'node:child_process';
import path from 'node:path';
import { PROJECT_ROOT } from '@server/config/config';

/** The fake's fixed credentials (s3rver accepts only these). */
export const FAKE_S3_CREDENTIALS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };

export interface S3Fake {
  endpoint: string;
  stop: () => Promise<void>;
}

/**
 * Starts the local fake S3 server (s3rver, see s3-fake-server.ts) as a child process on
 * 127.0.0.1:`port`, its objects under `folder` and `bucket` made at start, and waits until it
 * answers. A process of its own, like the mail catcher, keeps its work out of the API's memory.
 */
export async function startS3Fake(options: { port: number; folder: string; bucket: string }): Promise<S3Fake> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(__dirname, 's3-fake-server.ts'), String(options.port), options.folder, options.bucket], {
    cwd: PROJECT_ROOT,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let stderr = '';
  child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => {
      child.kill();
      reject(new Error(`The fake S3 server did not start on 127.0.0.1:${options.port} within 20 s.`));
    }, 20_000);
    child.stdout.on('data', (chunk: Buffer) => {
      if (!chunk.toString().includes('listening')) return;
      clearTimeout(timer);
      resolve();
    });
    child.once('exit', () => {
      clearTimeout(timer);
      reject(new Error(`The fake S3 server stopped at start (is port ${options.port} taken?): ${stderr.trim()}`));
    });
  });
  return {
    endpoint: `http://127.0.0.1:${options.port}`,
    stop: () =>
      child.exitCode !== null || child.signalCode !== null
        ? Promise.resolve()
        : new Promise<void>((resolve) => {
            child.once('exit', () => resolve());
            child.kill('SIGTERM');
          }),
  };
}
