import { RoundTimes } from './joined-round';
import { TimingFrame } from './station-geometry';

/** The locality margins of one round, in whole picoseconds, one per station's outcome. */
export interface RoundMargins {
  /** At station A's outcome: how long before B's setting choice could reach A it was recorded. */
  atA: bigint;
  /** At station B's outcome: how long before A's setting choice could reach B it was recorded. */
  atB: bigint;
}

/**
 * The margin of each outcome against the other station's setting choice, all in whole picoseconds:
 * margin = (t_setting,other + offset correction + d/c) − t_outcome,self − u. With B's clock ahead of
 * A's by the offset o (B − A), a time of B's is o later on A's clock: at A the correction is −o, at
 * B it is +o. u, the offset's uncertainty, is taken off every margin (counted against the lab), and
 * d/c is rounded down (see `timingFrame`), so a margin is never larger than the truth allows. An
 * outcome is space-like separated from the other setting choice when its margin is above 0: it was
 * recorded before light from that choice could arrive (Bell's locality condition as tested in the
 * loophole-free experiments, e.g. Hensen et al., Nature 526, 682 (2015), from memory).
 */
export function roundMargins(times: RoundTimes, frame: TimingFrame): RoundMargins {
  const { lightTimePs, clockOffsetPs, clockUncertaintyPs } = frame;
  return {
    atA: times.bSetting - clockOffsetPs + lightTimePs - times.aOutcome - clockUncertaintyPs,
    atB: times.aSetting + clockOffsetPs + lightTimePs - times.bOutcome - clockUncertaintyPs,
  };
}
