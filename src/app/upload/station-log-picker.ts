import { ChangeDetectionStrategy, Component, computed, input, model } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { StationName } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { LogDrop } from './log-drop';
import { readLogSample } from './log-preview';
import { checkStationLog, cleanCheckSentence, stationColumnsText, type StationLogCheck } from './station-log-check';

/** A station's log picked for upload, with what its start says (null while it is read). */
export interface PickedStationLog {
  readonly file: File;
  readonly compressed: boolean;
  readonly check: StationLogCheck | null;
}

/**
 * One station's own log: dropped or chosen, its start read in the browser by the engine's station
 * reader, and the header and first rows judged before anything is sent.
 */
@Component({
  selector: 'bk-station-log-picker',
  imports: [LogDrop, MatButtonModule, MatIconModule],
  templateUrl: './station-log-picker.html',
  styleUrl: './station-log-picker.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationLogPicker {
  /** Whose log this is. */
  readonly station = input.required<StationName>();
  /** The setup's name for the station ("North Hall"), or empty before a setup is chosen. */
  readonly stationLabel = input.required<string>();
  /** The picked log, or null. */
  readonly log = model<PickedStationLog | null>(null);

  protected readonly testId = computed(() => `station-${this.station().toLowerCase()}`);
  protected readonly title = computed(() => `Station ${this.station()}${this.stationLabel() ? ` · ${this.stationLabel()}` : ''}`);
  protected readonly columns = computed(() => stationColumnsText(this.station()));
  protected readonly count = formatCount;
  protected readonly cleanSentence = cleanCheckSentence;

  /** Reads the start of the file as this station's log; a later pick wins over one still being read. */
  async chooseLog(file: File): Promise<void> {
    this.log.set({ file, compressed: false, check: null });
    let picked: PickedStationLog;
    try {
      const sample = await readLogSample(file);
      picked = { file, compressed: sample.compressed, check: await checkStationLog(sample, this.station()) };
    } catch {
      picked = { file, compressed: false, check: { ok: false, cause: 'file', message: 'The file could not be read: it may be damaged gzip. Choose another file.' } };
    }
    if (this.log()?.file === file) this.log.set(picked);
  }

  protected removeLog(): void {
    this.log.set(null);
  }
}
