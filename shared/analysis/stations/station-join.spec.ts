import { JoinedRound } from './joined-round';
import { StationJoin, StationJoinOptions } from './station-join';
import { StationRow } from './station-row';
import { stationBatches } from './testing/station-batches';

/** Rows of one station at the given round indices; setting and outcome follow the index, times when asked. */
function rows(rounds: readonly number[], timed = false): StationRow[] {
  return rounds.map((round) => ({
    round,
    setting: round % 2,
    outcome: (round >> 1) % 2,
    settingTime: timed ? BigInt(round) * 1000n : null,
    outcomeTime: timed ? BigInt(round) * 1000n + 7n : null,
  }));
}

/** The rows in batches of `size`. */
const batches = (all: readonly StationRow[], size: number) => stationBatches(all, size);

async function join(a: readonly StationRow[], b: readonly StationRow[], options: StationJoinOptions = {}, size = 3) {
  const joinOf = new StationJoin(batches(a, size), batches(b, size), options);
  const joined: JoinedRound[] = [];
  const batchLengths: number[] = [];
  for await (const batch of joinOf.rounds()) {
    batchLengths.push(batch.length);
    joined.push(...batch.rounds());
  }
  return { joined, summary: joinOf.summary(), batchLengths };
}

const range = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, i) => from + i);

describe('StationJoin', () => {
  it("pairs A's round r with B's round r: settings and outcomes from each side, times when both have them", async () => {
    const { joined, summary } = await join(rows([0, 1, 2], true), rows([0, 1, 2], true));
    expect(joined[2]).toEqual({ round: 2, x: 0, y: 0, a: 1, b: 1, times: { aSetting: 2000n, aOutcome: 2007n, bSetting: 2000n, bOutcome: 2007n } });
    expect(summary).toMatchObject({ joinedRounds: 3, firstJoinedRound: 0, lastJoinedRound: 2, span: { firstRound: 0, lastRound: 2, triggers: 3 }, missing: 0, missingFromBoth: 0 });
    const { joined: untimed } = await join(rows([0, 1, 2], true), rows([0, 1, 2], false));
    expect(untimed.every((round) => round.times === null)).toBe(true);
  });

  it('counts the rounds present on one side only, per side, with the first ten of them and the longest gap', async () => {
    // A: 0 … 30 without 10 … 13; B: 2 … 34 without 5 and 20 … 29. Every index of 0 … 34 is held by one of them.
    const a = range(0, 30).filter((r) => r < 10 || r > 13);
    const b = range(2, 34).filter((r) => r !== 5 && (r < 20 || r > 29));
    const { joined, summary } = await join(rows(a), rows(b));
    expect(joined.map((round) => round.round)).toEqual([2, 3, 4, 6, 7, 8, 9, 14, 15, 16, 17, 18, 19, 30]);
    expect(summary.span).toEqual({ firstRound: 0, lastRound: 34, triggers: 35 });
    // B lacks 0, 1 (before it starts), 5, and 20 … 29, which only A holds: 13 rounds.
    expect(summary.stationB).toEqual({ lacking: 13, firstLacking: [0, 1, 5, 20, 21, 22, 23, 24, 25, 26], longestGap: { firstRound: 20, rounds: 10 } });
    // A lacks 10 … 13 (B holds them) and 31 … 34 after its end: 8 rounds, the longest gap 10 … 13 (the earlier of two of 4).
    expect(summary.stationA).toEqual({ lacking: 8, firstLacking: [10, 11, 12, 13, 31, 32, 33, 34], longestGap: { firstRound: 10, rounds: 4 } });
    expect(summary.joinedRounds).toBe(14);
    expect(summary.missing).toBe(35 - 14);
    expect(summary.missingFromBoth).toBe(0);
  });

  it('counts the round indices neither record holds as missing, and as gaps of both', async () => {
    const { summary } = await join(rows([0, 1, 5, 6]), rows([0, 1, 6]));
    expect(summary).toMatchObject({ joinedRounds: 3, missing: 4, missingFromBoth: 3 });
    expect(summary.stationA).toEqual({ lacking: 0, firstLacking: [], longestGap: { firstRound: 2, rounds: 3 } });
    expect(summary.stationB).toEqual({ lacking: 1, firstLacking: [5], longestGap: { firstRound: 2, rounds: 4 } });
  });

  it('finds the longest gap at the start of a record, whole span for a record with no rows', async () => {
    expect((await join(rows(range(0, 9)), rows(range(4, 9)))).summary.stationB.longestGap).toEqual({ firstRound: 0, rounds: 4 });
    const { summary, joined } = await join(rows(range(3, 9)), []);
    expect(joined).toEqual([]);
    expect(summary.stationB).toEqual({ lacking: 7, firstLacking: [3, 4, 5, 6, 7, 8, 9], longestGap: { firstRound: 3, rounds: 7 } });
    expect(summary).toMatchObject({ joinedRounds: 0, firstJoinedRound: null, missing: 7 });
    expect((await join([], [])).summary).toMatchObject({ span: null, missing: 0, stationA: { lacking: 0, longestGap: null } });
  });

  it("applies a stated offset k: A's round r meets B's round r + k, and the summary carries the reason", async () => {
    const statedOffset = { rounds: -3, reason: "  Mill Lane's counter started three triggers late (lab note 12) " };
    const { joined, summary } = await join(rows(range(3, 12)), rows(range(0, 9)), { statedOffset });
    expect(joined.map((round) => [round.round, round.y])).toEqual(range(3, 12).map((r) => [r, (r - 3) % 2]));
    expect(summary.statedOffset).toEqual({ rounds: -3, reason: "Mill Lane's counter started three triggers late (lab note 12)" });
    expect(summary).toMatchObject({ joinedRounds: 10, missing: 0, span: { firstRound: 3, lastRound: 12, triggers: 10 } });
  });

  it('refuses a stated offset without a reason or not whole', () => {
    expect(() => new StationJoin(batches([], 1), batches([], 1), { statedOffset: { rounds: 2, reason: ' ' } })).toThrow('a stated offset needs the reason it is applied');
    expect(() => new StationJoin(batches([], 1), batches([], 1), { statedOffset: { rounds: 1.5, reason: 'why' } })).toThrow(
      'a stated offset must be a whole number of rounds, not 1.5',
    );
  });

  it('hands on the joined rounds in batches no larger than asked', async () => {
    const { joined, batchLengths } = await join(rows(range(0, 99)), rows(range(0, 99)), { batchRounds: 8 }, 7);
    expect(joined).toHaveLength(100);
    expect(Math.max(...batchLengths)).toBeLessThanOrEqual(8);
    expect(batchLengths.every((length) => length > 0)).toBe(true);
  });
});
