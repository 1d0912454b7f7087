import type { StationFileSummary, StationJoinSummary, TimingSummary } from '@shared/analysis';
import type { RunStationsDto } from '@shared/api';
import { joinSentence, lackingSentence, statedOffsetWords, timingFigures, timingNotCheckedSentence } from './station-pair-words';

/** Thin spaces where the page writes them (thousands, before a unit), so expectations read plainly. */
const thin = (text: string) => text.replace(/(\d) (?=\d{3}\b)/g, '$1\u2009').replace(/ (ns|%)/g, '\u2009$1');

const join: StationJoinSummary = {
  statedOffset: null,
  joinedRounds: 11_880,
  firstJoinedRound: 1,
  lastJoinedRound: 12_000,
  span: { firstRound: 1, lastRound: 12_000, triggers: 12_000 },
  missing: 120,
  missingFromBoth: 0,
  stationA: { lacking: 0, firstLacking: [], longestGap: null },
  stationB: { lacking: 120, firstLacking: [4001, 4002, 4003], longestGap: { firstRound: 4001, rounds: 120 } },
};

const file = (station: 'A' | 'B', hasTimes: boolean): StationFileSummary => ({
  station,
  sha256: '',
  bytes: 0,
  compression: 'none',
  records: 0,
  rounds: 0,
  firstRound: null,
  lastRound: null,
  hasTimes,
  problemCount: 0,
});

describe('station pair words', () => {
  it('says what each station’s log lacks, with the first rounds and the longest gap', () => {
    expect(lackingSentence('A', join.stationA)).toBe('Station A’s log lacks no round that station B recorded.');
    expect(lackingSentence('B', join.stationB)).toBe(
      thin('Station B’s log lacks 120 rounds that station A recorded (4 001, 4 002, 4 003, …). Its longest gap: rounds 4 001 to 4 120 (120 rounds).'),
    );
    expect(lackingSentence('A', { lacking: 1, firstLacking: [7], longestGap: { firstRound: 7, rounds: 1 } })).toBe(
      'Station A’s log lacks 1 round that station B recorded (7). Its longest gap: round 7 (1 round).',
    );
  });

  it('says how many rounds were joined of the span either log holds', () => {
    expect(joinSentence(join)).toBe(
      thin('11 880 rounds joined of the 12 000 round indices from 1 to 12 000 that either log holds; 120 missing. A round only one station recorded is missing, never left out.'),
    );
    expect(joinSentence({ ...join, span: null })).toBe('Neither log holds a readable round: nothing was joined.');
  });

  it('words a stated offset with its pairing', () => {
    expect(statedOffsetWords(3)).toBe('+3: station A’s round r is paired with station B’s round r + 3');
    expect(statedOffsetWords(-2)).toBe('−2: station A’s round r is paired with station B’s round r − 2');
  });

  it('names exactly what kept the timing from being checked', () => {
    const stations: RunStationsDto = { stationB: { sha256: '', bytes: 0, originalName: '' }, offset: null, offsetReason: null, realignedFrom: null, geometry: null };
    expect(timingNotCheckedSentence(stations, [file('A', true), file('B', true)])).toBe(
      'The timing was not checked: the setup had no distance between its stations, or no clock offset of station B with its uncertainty, when the run was made.',
    );
    const geometry = { stationDistanceM: 1300, clockOffsetNs: 0, clockUncertaintyNs: 1 };
    expect(timingNotCheckedSentence({ ...stations, geometry }, [file('A', true), file('B', false)])).toBe(
      'The timing was not checked: station B’s log has no time columns (t_setting, t_outcome).',
    );
    expect(timingNotCheckedSentence({ ...stations, geometry }, [file('A', true), file('B', true)])).toBe('');
  });

  it('gives the timing figures in ns to the picosecond, with counts and share', () => {
    const timing: TimingSummary = {
      lightTimePs: 4_336_333,
      clockOffsetPs: -1_500,
      clockUncertaintyPs: 2_000,
      timedRounds: 12_000,
      untimedRounds: 0,
      notSpaceLike: 115,
      notSpaceLikeShare: 115 / 12_000,
      firstNotSpaceLike: [17, 240],
      smallestMargin: { round: 1963, station: 'B', picoseconds: -2_266_768 },
      histogram: [],
    };
    expect(timingFigures(timing)).toEqual({
      lightTime: thin('4 336.333 ns'),
      clockOffset: thin('−1.500 ns ± 2.000 ns'),
      timedRounds: thin('12 000'),
      smallestMargin: thin('−2 266.768 ns (round 1 963, at station B’s outcome)'),
      notSpaceLike: thin('115 of 12 000 (0.96 %); the first: 17, 240, …'),
      allSpaceLike: false,
    });
  });
});
