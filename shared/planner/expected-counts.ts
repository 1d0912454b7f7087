import { COUNT_CELLS, countCell } from '../analysis/tally/count-table';

export { CHSH_SETTING_SHARE } from '../analysis/report/sifted-protocol';

/** The device as the planner expects it. */
export interface ExpectedDevice {
  winFraction: number;
  qber: number;
  xZeroProbability: number;
}

/**
 * The expected count table of `rounds` rounds (fractional counts, in the engine's flat layout):
 * settings x with P(x = 0) as given and y uniform; CHSH rounds won with probability ω whatever the
 * pair (a ⊕ b = x·y on a win); key-setting rounds (x = 0, y = 2) disagree with probability QBER;
 * outcomes otherwise uniform. This is the device the engine's formulas assume, at its mean.
 */
export function expectedCountTable(device: ExpectedDevice, rounds: number): number[] {
  const table = new Array<number>(COUNT_CELLS).fill(0);
  for (const x of [0, 1]) {
    for (const y of [0, 1, 2]) {
      const share = (rounds * (x === 0 ? device.xZeroProbability : 1 - device.xZeroProbability)) / 3;
      for (const a of [0, 1]) {
        for (const b of [0, 1]) {
          table[countCell(x, y, a, b)] = share * cellProbability(device, x, y, a, b);
        }
      }
    }
  }
  return table;
}

/** P(a, b | x, y) of the expected device. */
function cellProbability(device: ExpectedDevice, x: number, y: number, a: number, b: number): number {
  if (y < 2) {
    const wins = (a ^ b) === x * y;
    return (wins ? device.winFraction : 1 - device.winFraction) / 2;
  }
  if (x === 0) return (a === b ? 1 - device.qber : device.qber) / 2;
  return 1 / 4;
}
