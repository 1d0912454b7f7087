import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import type { StationFileSummary } from '@shared/analysis';
import { STATIONS, type RunDto, type SetupDto, type StationName } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { CopyButton } from '../clipboard/copy-button';
import { AlignmentChart } from './alignment-chart';
import { MarginHistogramChart } from './margin-histogram-chart';
import { RealignForm } from './realign-form';
import { joinSentence, lackingSentence, statedOffsetWords, timingFigures, timingNotCheckedSentence } from './station-pair-words';

/** One station's file as the panel shows it: from the run (name, hash, size) and, once analysed, from the result. */
interface StationFileRow {
  readonly station: StationName;
  readonly label: string;
  readonly originalName: string;
  readonly sha256: string;
  readonly bytes: string;
  /** What the engine read of it, or null before the analysis. */
  readonly read: StationFileSummary | null;
}

/**
 * A run of two station logs: each station's file, what each record lacks, the stated offset with its
 * reason, the alignment check (sentence and chart of |S| against the offset), the timing check
 * (figures and histogram of margins, or why it was not checked) and the shift lead's re-run at a
 * stated offset.
 */
@Component({
  selector: 'bk-station-pair-panel',
  imports: [AlignmentChart, CopyButton, MarginHistogramChart, MatIconModule, RealignForm, RouterLink],
  templateUrl: './station-pair-panel.html',
  styleUrl: './station-pair-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationPairPanel {
  /** A run whose `stations` is set. */
  readonly run = input.required<RunDto>();
  /** The run's setup (station names, shift leads), or null while it loads. */
  readonly setup = input.required<SetupDto | null>();

  protected readonly stations = computed(() => this.run().stations!);
  /** The result's station section, once analysed. */
  protected readonly pair = computed(() => this.run().result?.stations ?? null);

  protected readonly files = computed<StationFileRow[]>(() => {
    const run = this.run();
    const setup = this.setup();
    return STATIONS.map((station) => {
      const file = station === 'A' ? run.file : this.stations().stationB;
      const label = setup === null ? '' : station === 'A' ? setup.stationALabel : setup.stationBLabel;
      return {
        station,
        label,
        originalName: file.originalName,
        sha256: file.sha256,
        bytes: formatCount(file.bytes),
        read: this.pair()?.files.find((read) => read.station === station) ?? null,
      };
    });
  });

  protected readonly joined = computed(() => {
    const join = this.pair()?.join;
    return join ? { sentence: joinSentence(join), lacking: STATIONS.map((station) => lackingSentence(station, station === 'A' ? join.stationA : join.stationB)) } : null;
  });

  /** The stated offset, in words, or null when the records are paired as written. */
  protected readonly statedOffset = computed(() => {
    const { offset } = this.stations();
    return offset === null ? null : statedOffsetWords(offset);
  });

  /** Whether the run is INVALID because its records are shifted. */
  protected readonly invalidFromShift = computed(() => this.run().verdict === 'INVALID' && this.pair()?.alignment?.shifted === true);

  protected readonly timing = computed(() => {
    const timing = this.pair()?.timing ?? null;
    return timing === null ? null : { summary: timing, figures: timingFigures(timing) };
  });
  /** Why the timing was not checked, once analysed; empty when it was, or when a log could not be read. */
  protected readonly timingMissing = computed(() => {
    const pair = this.pair();
    if (pair === null || pair.timing !== null) return '';
    return pair.join === null ? 'A log could not be read, so neither the alignment nor the timing was checked.' : timingNotCheckedSentence(this.stations(), pair.files);
  });

  protected readonly count = formatCount;
}
