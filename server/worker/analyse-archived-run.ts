import { analyseLog } from '@shared/analysis/node';
import type { ProgressListener } from '@shared/analysis/node';
import { log } from '../system/log';
import type { AnalysisResult } from '@shared/analysis';
import type { Models } from '../database/models';
import type { RunRecord } from '../runs/run.model';
import type { LogStore } from '../storage/log-store';

/**
 * Runs the engine on a run's archived file exactly as recorded at upload: its profile version,
 * column mapping and seed. The first analysis and every re-verification go through here. The
 * engine reads a local file: the store's own, or a copy in the worker's work folder (see LogStore).
 * The census taken at upload spares it a counting pass; the engine checks it against the bytes it
 * reads and counts for itself when it does not fit.
 */
export async function analyseArchivedRun(
  run: Pick<RunRecord, 'profileVersionId' | 'fileSha256' | 'mapping' | 'seed'>,
  deps: { models: Models; logStore: LogStore; workFolder: string },
  options: { onProgress?: ProgressListener; signal: AbortSignal },
): Promise<AnalysisResult> {
  const profileVersion = (await deps.models.ProfileVersion.findByPk(run.profileVersionId))!;
  const archived = await deps.models.ArchiveFile.findByPk(run.fileSha256);
  const census = archived?.census ? { sha256: run.fileSha256, census: archived.census } : undefined;
  return deps.logStore.withLocalFile(run.fileSha256, deps.workFolder, (file) =>
    analyseLog(
      { path: file },
      {
        profile: profileVersion.parameters,
        mapping: run.mapping ?? undefined,
        seed: run.seed,
        census,
        onCensusMismatch: (reason) => log.warn({ sha256: run.fileSha256, reason }, 'the stored census does not fit the archived log: counted again'),
        onProgress: options.onProgress,
        signal: options.signal,
      },
    ),
  );
}
