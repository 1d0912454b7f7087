import { ColumnMapping } from '../log/column-mapping';
import { resolveHeader } from '../log/header-layout';
import { LogProblem } from '../log/log-problem';
import { RangeAnalysis, RangeSummary } from '../log/range-analysis';
import { FIRST_DATA_LINE, planRanges, spanProblem, TriggerSpan } from '../log/range-plans';
import { AnalysisProfile } from '../profile';
import { KeystreamSource } from '../selection/keystream';
import { countCell } from '../tally/count-table';
import { JoinedBatch } from './joined-round';

/** The joined stream as the engine's record path reads it: a joined log's columns, outcomes already 0/1 (the station readers decode ±1). */
const JOINED_COLUMNS = ['round', 'x', 'y', 'a', 'b'];
const JOINED_MAPPING: ColumnMapping = { columns: {}, outcomes: '0/1' };

/**
 * Feeds the joined rounds of two station records to the engine's own record path (`RangeAnalysis`:
 * the record checks, the trigger selection, the tallies and blocks), as one stretch whose trigger
 * span is the span of both records. Round i of the stream stands on line i + 2 of a joined log.
 * Holds nothing per round.
 */
export class JoinedStreamAnalysis {
  private readonly analysis: RangeAnalysis;
  /** Each round's count cell, for a batch. */
  private cells = new Uint8Array(0);
  private line = FIRST_DATA_LINE;

  private constructor(analysis: RangeAnalysis) {
    this.analysis = analysis;
  }

  /**
   * The analysis of `joinedRounds` joined rounds over `span`, the span of both records (from the
   * first join pass), or the problem that refuses it: as for a joined log, a span with more
   * triggers missing than rounds joined is no trigger count (`spanProblem`).
   */
  static start(profile: AnalysisProfile, span: TriggerSpan, joinedRounds: number, keystream: KeystreamSource | null): JoinedStreamAnalysis | LogProblem {
    const resolved = resolveHeader(JOINED_COLUMNS, JOINED_MAPPING, false);
    if (!resolved.ok) throw new Error(resolved.message);
    const layout = resolved.layout;
    const problem = spanProblem(span, joinedRounds, layout);
    if (problem !== null) return problem;
    const edges = { firstRound: span.firstRound, lastRound: span.lastRound, previousRounds: [NaN] };
    const [plan] = planRanges(layout, profile, [{ lines: joinedRounds, records: joinedRounds }], edges);
    return new JoinedStreamAnalysis(new RangeAnalysis(plan, keystream));
  }

  /**
   * A batch of joined rounds, in round order: handed to the engine as the row kernel hands it rows
   * (`RangeAnalysis.acceptRows`: each round index and its count cell, no test mark), since the
   * station readers have checked every field; the order and the gaps are checked there.
   */
  add(rounds: JoinedBatch): void {
    if (this.cells.length < rounds.length) this.cells = new Uint8Array(rounds.capacity);
    const cells = this.cells;
    for (let k = 0; k < rounds.length; k++) cells[k] = countCell(rounds.x[k], rounds.y[k], rounds.a[k], rounds.b[k]);
    this.analysis.acceptRows(this.line, rounds.length, rounds.round, cells);
    this.line += rounds.length;
  }

  /** The stream's summary once its last round is in: the triggers after the last joined round take their decisions first. */
  summary(): RangeSummary {
    this.analysis.drawTriggersToSpanEnd();
    return this.analysis.summary();
  }
}
