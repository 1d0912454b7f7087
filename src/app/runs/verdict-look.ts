import { STATE_OF_VERDICT, type RunState, type Verdict } from '@shared/api';

/** The tone of a run's state: names the `bk-tone-*` class and the `--bk-*` colour. */
export type VerdictTone = 'accept' | 'abort' | 'invalid' | 'pending';

/** How a run's state or verdict is shown: always an icon and a word, never the colour alone. */
export interface VerdictLook {
  /** The word on the chip. */
  readonly word: string;
  /** Material Symbols name. */
  readonly icon: string;
  readonly tone: VerdictTone;
}

const LOOKS: Record<RunState, VerdictLook> = {
  queued: { word: 'Queued', icon: 'schedule', tone: 'pending' },
  analysing: { word: 'Analysing', icon: 'hourglass_top', tone: 'pending' },
  accepted: { word: 'ACCEPT', icon: 'verified', tone: 'accept' },
  aborted: { word: 'ABORT', icon: 'block', tone: 'abort' },
  invalid: { word: 'INVALID', icon: 'error', tone: 'invalid' },
  failed: { word: 'Analysis failed', icon: 'sync_problem', tone: 'invalid' },
};

/** The look of a run in `state`. */
export function lookOfState(state: RunState): VerdictLook {
  return LOOKS[state];
}

/** The look of a verdict. */
export function lookOfVerdict(verdict: Verdict): VerdictLook {
  return LOOKS[STATE_OF_VERDICT[verdict]];
}
