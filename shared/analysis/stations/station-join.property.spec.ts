import fc from 'fast-check';
import { JoinedRound } from './joined-round';
import { RecordGaps } from './record-gaps';
import { Station } from './station-columns';
import { StationBatch } from './station-batch';
import { StationJoin } from './station-join';
import { StationLogReader } from './station-log-reader';
import { asyncSlices } from './testing/async-slices';

/** One trigger of a generated night: both stations' halves, and which records keep it. */
const trigger = fc.record({
  step: fc.oneof({ weight: 8, arbitrary: fc.constant(1) }, { weight: 1, arbitrary: fc.integer({ min: 2, max: 4 }) }),
  x: fc.integer({ min: 0, max: 1 }),
  y: fc.integer({ min: 0, max: 2 }),
  a: fc.integer({ min: 0, max: 1 }),
  b: fc.integer({ min: 0, max: 1 }),
  times: fc.array(fc.bigInt({ min: 0n, max: 2n ** 63n - 1n }), { minLength: 4, maxLength: 4 }),
  keptBy: fc.constantFrom('both', 'both', 'both', 'both', 'both', 'A', 'B'),
});

/** How one station writes its log. */
const writing = fc.record({
  outcomes: fc.constantFrom('0/1' as const, '±1' as const),
  times: fc.boolean(),
  note: fc.boolean(),
  reversed: fc.boolean(),
  crlf: fc.boolean(),
  bom: fc.boolean(),
  piece: fc.integer({ min: 1, max: 200 }),
  batch: fc.integer({ min: 1, max: 9 }),
});

type Trigger = typeof trigger extends fc.Arbitrary<infer T> ? T : never;
type Writing = typeof writing extends fc.Arbitrary<infer T> ? T : never;

/** A station's log text: its rows at `round + shift` for the triggers it keeps. */
function stationLog(station: Station, triggers: readonly (Trigger & { round: number })[], how: Writing, shift: number): Uint8Array {
  const names = station === 'A' ? ['round', 'x', 'a'] : ['round', 'y', 'b'];
  const columns = [...names, ...(how.times ? ['t_setting', 't_outcome'] : []), ...(how.note ? ['note'] : [])];
  const header = how.reversed ? [...columns].reverse() : columns;
  const outcome = (o: number) => (how.outcomes === '±1' ? (o === 0 ? '+1' : '-1') : String(o));
  const lines = triggers
    .filter((t) => t.keptBy === 'both' || t.keptBy === station)
    .map((t) => {
      const [setting, result, settingTime, outcomeTime] = station === 'A' ? [t.x, t.a, t.times[0], t.times[1]] : [t.y, t.b, t.times[2], t.times[3]];
      const byName: Record<string, string> = {
        round: String(t.round + shift),
        x: String(setting),
        y: String(setting),
        a: outcome(result),
        b: outcome(result),
        t_setting: String(settingTime),
        t_outcome: String(outcomeTime),
        note: '"n, o"',
      };
      return header.map((name) => byName[name]).join(',');
    });
  const end = how.crlf ? '\r\n' : '\n';
  return new TextEncoder().encode((how.bom ? '\ufeff' : '') + [header.join(','), ...lines].join(end) + end);
}

/** A reader's rows, the bytes cut into pieces, the rows regrouped into batches of `batch`. */
async function* stationRows(reader: StationLogReader, bytes: Uint8Array, how: Writing) {
  for await (const batch of reader.rows(asyncSlices(bytes, how.piece))) {
    const rows = batch.rows();
    for (let at = 0; at < rows.length; at += how.batch) yield StationBatch.of(rows.slice(at, at + how.batch), batch.timed);
  }
}

/** What a record lacks, by brute force over the span. */
function expectedGaps(own: ReadonlySet<number>, other: ReadonlySet<number>, first: number, last: number): RecordGaps {
  const lacking = [...other].filter((round) => !own.has(round)).sort((p, q) => p - q);
  let longestGap: RecordGaps['longestGap'] = null;
  let run = 0;
  for (let round = first; round <= last + 1; round++) {
    if (round <= last && !own.has(round)) {
      run++;
      continue;
    }
    if (run > (longestGap?.rounds ?? 0)) longestGap = { firstRound: round - run, rounds: run };
    run = 0;
  }
  return { lacking: lacking.length, firstLacking: lacking.slice(0, 10), longestGap };
}

describe('the join of two station logs', () => {
  it('gives exactly the rounds of the pre-joined night both records hold, and counts the rest per side', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(trigger, { minLength: 0, maxLength: 60 }),
        fc.constantFrom(0, 7, 2 ** 40),
        fc.integer({ min: -5, max: 5 }),
        writing,
        writing,
        async (generated, firstRound, offset, howA, howB) => {
          let round = firstRound;
          const triggers = generated.map((t, i) => ({ ...t, round: i === 0 ? round : (round += t.step) }));
          const shift = firstRound + offset < 0 ? 0 : offset;
          const readerA = new StationLogReader('A', howA.outcomes);
          const readerB = new StationLogReader('B', howB.outcomes);
          const join = new StationJoin(stationRows(readerA, stationLog('A', triggers, howA, 0), howA), stationRows(readerB, stationLog('B', triggers, howB, shift), howB), {
            statedOffset: { rounds: shift, reason: 'the property test wrote B shifted' },
            batchRounds: 5,
          });
          const joined: JoinedRound[] = [];
          for await (const batch of join.rounds()) joined.push(...batch.rounds());
          const heldA = new Set(triggers.filter((t) => t.keptBy !== 'B').map((t) => t.round));
          const heldB = new Set(triggers.filter((t) => t.keptBy !== 'A').map((t) => t.round));
          // A record without rows is refused ("a header but no rounds"), and that is all that is wrong.
          expect([readerA.summary().problemCount, readerB.summary().problemCount]).toEqual([heldA.size === 0 ? 1 : 0, heldB.size === 0 ? 1 : 0]);

          const both = triggers.filter((t) => t.keptBy === 'both');
          const timed = howA.times && howB.times;
          expect(joined).toEqual(
            both.map((t) => ({
              round: t.round,
              x: t.x,
              y: t.y,
              a: t.a,
              b: t.b,
              times: timed ? { aSetting: t.times[0], aOutcome: t.times[1], bSetting: t.times[2], bOutcome: t.times[3] } : null,
            })),
          );
          const all = [...heldA, ...heldB];
          const summary = join.summary();
          if (all.length === 0) {
            expect(summary.span).toBeNull();
            return;
          }
          const first = Math.min(...all);
          const last = Math.max(...all);
          expect(summary.span).toEqual({ firstRound: first, lastRound: last, triggers: last - first + 1 });
          expect(summary.joinedRounds).toBe(both.length);
          expect(summary.missing).toBe(last - first + 1 - both.length);
          expect(summary.stationA).toEqual(expectedGaps(heldA, heldB, first, last));
          expect(summary.stationB).toEqual(expectedGaps(heldB, heldA, first, last));
          expect(summary.missingFromBoth).toBe(last - first + 1 - new Set(all).size);
        },
      ),
      { numRuns: 150 },
    );
  });
});
