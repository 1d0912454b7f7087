import { readFileSync } from 'node:fs';
import * as path from 'node:path';
import { gzipSync } from 'node:zlib';
import { analyseLog } from './analyse-log';
import { AnalysisCancelledError, AnalysisRequestError } from './analysis-errors';
import { AnalysisProgress } from './analysis-progress';

const ACCEPTED = path.resolve(__dirname, '../../../fixtures/logs/accepted-run.csv');
const SEED = '3c'.repeat(32);

describe('analyseLog', () => {
  it('reports progress for both passes up to the file size', async () => {
    const seen: AnalysisProgress[] = [];
    await analyseLog({ path: ACCEPTED }, { seed: SEED, onProgress: (progress) => seen.push(progress) });
    const size = readFileSync(ACCEPTED).length;
    expect(seen.filter((p) => p.phase === 'counting').at(-1)).toEqual({ phase: 'counting', bytesRead: size, totalBytes: size });
    expect(seen.filter((p) => p.phase === 'analysing').at(-1)).toEqual({ phase: 'analysing', bytesRead: size, totalBytes: size });
  });

  it('stops with AnalysisCancelledError when its signal is aborted', async () => {
    const controller = new AbortController();
    const running = analyseLog({ path: ACCEPTED }, { seed: SEED, onProgress: () => controller.abort(), signal: controller.signal });
    await expect(running).rejects.toBeInstanceOf(AnalysisCancelledError);
  });

  it('reads a stream source and gives the file result', async () => {
    const bytes = readFileSync(ACCEPTED);
    const fromFile = await analyseLog({ path: ACCEPTED }, { seed: SEED });
    const fromStream = await analyseLog({ open: async function* () { yield bytes.subarray(0, 1000); yield bytes.subarray(1000); } }, { seed: SEED });
    expect(fromStream).toEqual(fromFile);
  });

  it('calls damaged gzip data INVALID with a message', async () => {
    const gzip = gzipSync(readFileSync(ACCEPTED));
    const damaged = Buffer.concat([gzip.subarray(0, 5000), Buffer.alloc(200, 7), gzip.subarray(5200)]);
    const result = await analyseLog({ open: async function* () { yield damaged; } }, { seed: SEED });
    expect(result.verdict).toBe('INVALID');
    expect(result.errors[0].message).toContain('gzip data is damaged');
  });

  it('refuses a bad seed, profile or mapping with an AnalysisRequestError naming it', async () => {
    await expect(analyseLog({ path: ACCEPTED }, { seed: 'xyz' })).rejects.toThrow(/64 hexadecimal/);
    await expect(analyseLog({ path: ACCEPTED }, { profile: { driftBlocks: 1 } })).rejects.toThrow(/driftBlocks/);
    await expect(analyseLog({ path: ACCEPTED }, { mapping: { outcomes: 'yes/no' } })).rejects.toBeInstanceOf(AnalysisRequestError);
  });

  it('certified criterion is stricter than observed', async () => {
    // Same log and seed: the Hoeffding-corrected win fraction is lower, so a tolerance that the
    // observed value meets can fail once corrected.
    const observed = await analyseLog({ path: ACCEPTED }, { seed: SEED, profile: { chshTolerance: 0.02, criterion: 'observed' } });
    const certified = await analyseLog({ path: ACCEPTED }, { seed: SEED, profile: { chshTolerance: 0.02, criterion: 'certified' } });
    expect(observed.verdict).toBe('ACCEPT');
    expect(certified.verdict).toBe('ABORT');
    expect(certified.reasons[0]).toContain('lower bound of the CHSH win fraction');
  });
});
