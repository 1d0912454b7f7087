import { CheckFinding } from './check-result';

/**
 * Log integrity of a log that passed the reading rules (so no repeats or steps back): gaps in the
 * round indices are counted and reported as a warning, never as a failure, since detectors lose rounds.
 */
export function logIntegrityCheck(rounds: number, gaps: number, firstRound: number | null, lastRound: number | null): CheckFinding {
  const span = firstRound === null ? 'no rounds' : `round indices ${firstRound} to ${lastRound}`;
  return {
    id: 'log-integrity',
    family: 'log-integrity',
    holds: gaps === 0,
    advisory: true,
    observed: gaps,
    threshold: 0,
    message:
      gaps === 0
        ? `${rounds} rounds, ${span}, strictly increasing with no gaps.`
        : `${rounds} rounds, ${span}, strictly increasing; ${gaps} round indices are missing.`,
  };
}
