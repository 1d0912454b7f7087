import { CheckFinding } from './check-result';

/** Minimum test rounds: both the CHSH test rounds and the key-setting test rounds must reach the profile's minimum. */
export function minimumTestRoundsCheck(chshRounds: number, keyRounds: number, minimum: number): CheckFinding {
  const fewest = Math.min(chshRounds, keyRounds);
  const holds = fewest >= minimum;
  return {
    id: 'minimum-test-rounds',
    family: 'minimum-test-rounds',
    holds,
    observed: fewest,
    threshold: minimum,
    message: `${chshRounds} CHSH test rounds and ${keyRounds} key-setting test rounds; ${holds ? 'both reach' : 'fewer than'} the minimum of ${minimum}.`,
  };
}
