import { concat, defer, map, type Observable } from 'rxjs';

import { otherStation, type StationName } from '@shared/api';
import type { UploadArrival, UploadProgress } from './resumable-uploads';
import type { LogUpload } from './upload-metadata';

/** A station's own log to send. */
export type StationLogUpload = LogUpload & { station: StationName };

/** Where the sending of a night's station logs is: the share of all their bytes sent, or what one station's log made. */
export type StationUploadProgress = { kind: 'sending'; fraction: number } | { kind: 'arrived'; station: StationName; arrival: UploadArrival };

/**
 * Sends the station logs one after the other (station A's first), each as its own resumable upload
 * with its station. The fraction counts the bytes of all of them; each log's arrival (a run, or the
 * log waiting for the other station's) is told as it comes. A refusal stops the ones after it.
 */
export function sendStationLogs(send: (log: LogUpload) => Observable<UploadProgress>, logs: readonly StationLogUpload[]): Observable<StationUploadProgress> {
  const total = logs.reduce((sum, log) => sum + log.log.size, 0);
  let before = 0;
  return concat(
    ...logs.map((log) =>
      defer(() => send(log)).pipe(
        map((progress): StationUploadProgress => {
          if (progress.kind === 'sending') return { kind: 'sending', fraction: total > 0 ? (before + progress.fraction * log.log.size) / total : 0 };
          before += log.log.size;
          return { kind: 'arrived', station: log.station, arrival: progress };
        }),
      ),
    ),
  );
}

/** What one station's log made, in a sentence: "Station A's log is in; the night waits for station B's." */
export function arrivalSentence(station: StationName, arrival: UploadArrival): string {
  const other = otherStation(station);
  return arrival.kind === 'waiting'
    ? `Station ${station}’s log is in; the night waits for station ${other}’s.`
    : `Station ${station}’s log is in and joins station ${other}’s: the night is run ${arrival.run.id}.`;
}
