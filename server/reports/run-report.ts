import { RUN_REPORT_FORMAT, VERDICT_STATES, type RunReportDto } from '@shared/api';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import type { ReverificationsService } from '../integrity/reverifications.service';
import type { SigningKeysService } from '../integrity/signing-keys.service';
import type { RunsService } from '../runs/runs.service';
import type { SetupsService } from '../setups/setups.service';

export interface RunReportDeps {
  models: Models;
  runs: RunsService;
  setups: SetupsService;
  signingKeys: SigningKeysService;
  reverifications: ReverificationsService;
}

/** The whole report of a run with a stored result, as exported by `GET /api/runs/:id/export/json`. */
export async function buildRunReport(runId: number, exportedBy: string, deps: RunReportDeps): Promise<RunReportDto> {
  const run = await deps.runs.get(runId);
  if (!VERDICT_STATES.includes(run.state) || !run.result) {
    throw HttpError.conflict(`Run ${runId} is ${run.state}: only a run with a stored result can be exported.`);
  }
  const setup = await deps.setups.get(run.setupId);
  const version = (await deps.models.ProfileVersion.findByPk(run.profileVersionId))!;
  return {
    format: RUN_REPORT_FORMAT,
    formatVersion: 1,
    exportedAt: new Date().toISOString(),
    exportedBy,
    run: {
      id: run.id,
      setupName: run.setupName,
      stationA: setup.stationALabel,
      stationB: setup.stationBLabel,
      originalName: run.file.originalName,
      uploadedBy: run.uploadedBy,
      acquiredOn: run.acquiredOn,
      notes: run.notes,
      createdAt: run.createdAt,
      finishedAt: run.finishedAt,
      state: run.state,
      verdict: run.verdict,
      duplicateOf: run.duplicateOf,
      booking: run.booking,
      replayOf: run.replayOf,
    },
    profile: { profileId: version.profileId, versionId: version.id, name: run.profileName, version: version.version, parameters: version.parameters },
    mapping: run.mapping,
    seed: run.seed,
    result: run.result,
    signature: run.signature,
    publicKey: run.signature ? await deps.signingKeys.find(run.signature.keyId) : null,
    signOff: run.signOff,
    withdrawal: run.withdrawal,
    stations: run.stations,
    reverifications: await deps.reverifications.list(runId),
  };
}
