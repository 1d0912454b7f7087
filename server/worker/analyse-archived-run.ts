import { analyseLog, analyseStationPair } from '@shared/analysis/node';
import type { ProgressListener } from '@shared/analysis/node';
import { log } from '../system/log';
import type { AnalysisResult } from '@shared/analysis';
import type { Models } from '../database/models';
import type { RunRecord } from '../runs/run.model';
import { stationPairOptions } from '../runs/station-pair-record';
import type { LogStore } from '../storage/log-store';

type ArchivedRun = Pick<RunRecord, 'profileVersionId' | 'fileSha256' | 'mapping' | 'seed'> &
  Partial<Pick<RunRecord, 'stationBSha256' | 'stationBName' | 'stationOffset' | 'offsetReason' | 'stationGeometry'>>;

/**
 * Runs the engine on a run's archived file exactly as recorded at upload: its profile version,
 * column mapping and seed; for two station logs both files, with the stated offset and the
 * geometry kept with the run. The first analysis and every re-verification go through here. The
 * engine reads a local file: the store's own, or a copy in the worker's work folder (see LogStore).
 * The census taken at upload spares a joined log's analysis a counting pass; the engine checks it
 * against the bytes it reads and counts for itself when it does not fit.
 */
export async function analyseArchivedRun(
  run: ArchivedRun,
  deps: { models: Models; logStore: LogStore; workFolder: string },
  options: { onProgress?: ProgressListener; signal: AbortSignal },
): Promise<AnalysisResult> {
  const profileVersion = (await deps.models.ProfileVersion.findByPk(run.profileVersionId))!;
  if (run.stationBSha256) {
    const recorded = {
      fileSha256: run.fileSha256,
      mapping: run.mapping,
      seed: run.seed,
      stations: {
        stationB: { sha256: run.stationBSha256, bytes: 0, originalName: run.stationBName ?? '' },
        offset: run.stationOffset ?? null,
        offsetReason: run.offsetReason ?? null,
        geometry: run.stationGeometry ?? null,
      },
    };
    return deps.logStore.withLocalFile(run.fileSha256, deps.workFolder, (fileA) =>
      deps.logStore.withLocalFile(run.stationBSha256!, deps.workFolder, (fileB) =>
        analyseStationPair({ path: fileA }, { path: fileB }, stationPairOptions(recorded, profileVersion.parameters)),
      ),
    );
  }
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
