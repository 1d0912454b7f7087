import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { readLogHead } from '@shared/analysis/log/log-head';
import { LineCounter } from '@shared/analysis/log/line-counter';
import { createLineCounter } from '@shared/analysis/node/wasm-line-counter';
import { UniformStream } from '@shared/analysis/selection/uniform-stream';
import { aesKeystream } from '@shared/analysis/node/aes-keystream';
import { createRowKernel } from '@shared/analysis/node/wasm-row-kernel';

// Where an analysis's processor time goes, part by part, each on one thread over a log already in
// memory: `node dist/server/measure-parts.js <plain log>` prints the CPU seconds (user + system, so
// other processes on the machine count little) of the SHA-256, the line count of the counting pass
// (the TypeScript rule, and the WebAssembly count the engine uses),
// the keystream turned into uniform numbers for every round, and the row kernel reading every row
// (parse and checks only). Medians of 3. What the engine's two threads must share at the least.

const CHUNK = 1 << 20;

function cpuSeconds(work: () => void): number {
  const runs = [0, 1, 2].map(() => {
    const before = process.cpuUsage();
    work();
    const used = process.cpuUsage(before);
    return (used.user + used.system) / 1e6;
  });
  return runs.sort((a, b) => a - b)[1];
}

function main(): void {
  const bytes = readFileSync(process.argv[2]);
  const head = readLogHead(bytes.subarray(0, 1 << 16), false, { columns: {}, outcomes: '0/1' }, false);
  if (!head.ok) throw new Error('the log has no usable header');
  let rows = 0;
  const parts: Record<string, number> = {
    sha256: cpuSeconds(() => {
      const hash = createHash('sha256');
      for (let at = 0; at < bytes.length; at += CHUNK) hash.update(bytes.subarray(at, at + CHUNK));
      hash.digest();
    }),
    lineCount: cpuSeconds(() => {
      const counter = new LineCounter();
      for (let at = 0; at < bytes.length; at += CHUNK) counter.push(bytes.subarray(at, at + CHUNK));
    }),
    lineCountWasm: cpuSeconds(() => {
      const counter = createLineCounter();
      for (let at = 0; at < bytes.length; at += CHUNK) counter.push(bytes.subarray(at, at + CHUNK));
    }),
  };
  const kernel = createRowKernel(head.layout);
  if (kernel === null) throw new Error('no row kernel: run the build step first');
  parts.kernelRead = cpuSeconds(() => {
    rows = 0;
    // Pieces cut just after a line break, so every piece holds whole rows.
    for (let at = head.dataOffset; at < bytes.length;) {
      const end = Math.min(bytes.indexOf(10, Math.min(at + CHUNK, bytes.length - 1)) + 1 || bytes.length, bytes.length);
      kernel.load(bytes.subarray(at, end));
      for (let from = 0; ;) {
        from = kernel.read(from, 8192);
        if (kernel.rowCount === 0) break;
        rows += kernel.rowCount;
      }
      at = end;
    }
  });
  parts.keystream = cpuSeconds(() => {
    const uniforms = new UniformStream(aesKeystream('5e'.repeat(32)), 0);
    let sum = 0;
    for (let round = 0; round < rows; round++) sum += uniforms.next();
    if (!(sum >= 0)) throw new Error('no uniform numbers');
  });
  process.stdout.write(JSON.stringify({ bytes: bytes.length, rows, cpuSeconds: parts }) + '\n');
}

main();
