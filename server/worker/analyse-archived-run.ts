import { analyseLog } from '../../shared/analysis/node';
import type { ProgressListener } from '../../shared/analysis/node';
import type { AnalysisResult } from '../../shared/analysis/result';
import type { LocalArchive } from '../archive/local-archive';
import type { Models } from '../database/models';
import type { RunRecord } from '../runs/run.model';

/**
 * Runs the engine on a run's archived file exactly as recorded at upload: its profile version,
 * column mapping and seed. The first analysis and every re-verification go through here.
 */
export async function analyseArchivedRun(
  run: RunRecord,
  deps: { models: Models; archive: LocalArchive },
  options: { onProgress?: ProgressListener; signal: AbortSignal },
): Promise<AnalysisResult> {
  const profileVersion = (await deps.models.ProfileVersion.findByPk(run.profileVersionId))!;
  return analyseLog(
    { path: deps.archive.pathOf(run.fileSha256) },
    { profile: profileVersion.parameters, mapping: run.mapping ?? undefined, seed: run.seed, onProgress: options.onProgress, signal: options.signal },
  );
}
