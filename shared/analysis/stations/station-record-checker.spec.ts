import fc from 'fast-check';
import { splitCsvLine } from '../log/csv-line';
import { ProblemList } from '../log/log-problem';
import { Station } from './station-columns';
import { resolveStationHeader } from './station-header';
import { StationRecordChecker } from './station-record-checker';

/** Field texts: mostly valid, sometimes quoted, sometimes broken in the ways logs break. */
const fieldText = (valid: fc.Arbitrary<string>) =>
  fc.oneof(
    { weight: 12, arbitrary: valid },
    { weight: 1, arbitrary: valid.map((v) => `"${v}"`) },
    {
      weight: 2,
      arbitrary: fc.constantFrom('', 'two', '1.0', ' 1', '+1', '-1', '-0', '3', '2', '99999999999999999999', '0x1', '9223372036854775808', '00000000000000000012', '1\r'),
    },
  );

const time = fc.oneof(fc.bigInt({ min: 0n, max: 2n ** 63n - 1n }).map(String), fc.bigInt({ min: 0n, max: 10n ** 15n }).map(String));

const rowFields = fc.record({
  step: fc.oneof({ weight: 10, arbitrary: fc.integer({ min: 1, max: 3 }) }, { weight: 1, arbitrary: fc.integer({ min: -2, max: 0 }) }),
  setting: fieldText(fc.constantFrom('0', '1', '2')),
  outcome: fieldText(fc.constantFrom('0', '1', '+1', '-1')),
  settingTime: fieldText(time),
  outcomeTime: fieldText(time),
  note: fc.constantFrom('', 'ok', '"a, b"', 'x"y'),
  shape: fc.constantFrom('whole', 'whole', 'whole', 'short', 'long'),
});

describe('StationRecordChecker', () => {
  it('takes exactly the rows, values and problems of the split path on its fast path', () => {
    fc.assert(
      fc.property(
        fc.constantFrom<Station>('A', 'B'),
        fc.constantFrom('0/1' as const, '±1' as const),
        fc.boolean(),
        fc.array(rowFields, { minLength: 1, maxLength: 30 }),
        (station, outcomes, withNote, rows) => {
          const names = station === 'A' ? ['round', 'x', 'a', 't_setting', 't_outcome'] : ['t_outcome', 'round', 'y', 'b', 't_setting'];
          const header = withNote ? [...names, 'note'] : names;
          const resolved = resolveStationHeader(header, station, outcomes);
          if (!resolved.ok) throw new Error(resolved.message);
          const fast = new ProblemList();
          const slow = new ProblemList();
          const fastChecker = new StationRecordChecker(resolved.layout, fast);
          const slowChecker = new StationRecordChecker(resolved.layout, slow);
          let round = 0;
          rows.forEach((r, i) => {
            round = Math.max(0, round + r.step);
            const byName: Record<string, string> = {
              round: String(round),
              x: r.setting,
              y: r.setting,
              a: r.outcome,
              b: r.outcome,
              t_setting: r.settingTime,
              t_outcome: r.outcomeTime,
              note: r.note,
            };
            const fields = header.map((name) => byName[name]);
            const shaped = r.shape === 'short' ? fields.slice(0, -1) : r.shape === 'long' ? [...fields, '0'] : fields;
            const text = shaped.join(',');
            const split = splitCsvLine(text);
            const expected = 'error' in split ? null : slowChecker.accept(i + 2, split.fields);
            if ('error' in split) slow.add(i + 2, null, text, `the row's quoting is broken: ${split.error}`);
            expect(fastChecker.acceptText(i + 2, text)).toEqual(expected);
          });
          expect(fast.listed).toEqual(slow.listed);
          expect(fastChecker.gaps).toBe(slowChecker.gaps);
        },
      ),
    );
  });
});
