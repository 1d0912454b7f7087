import { REVERIFICATION_STATES, type ReverificationState } from '@shared/api';
import type { VerdictLook } from './verdict-look';

const LOOKS: Record<ReverificationState, VerdictLook> = {
  queued: { word: 'Queued', icon: 'schedule', tone: 'pending' },
  analysing: { word: 'Analysing', icon: 'hourglass_top', tone: 'pending' },
  reproduced: { word: 'Reproduced', icon: 'task_alt', tone: 'accept' },
  differs: { word: 'Differs', icon: 'difference', tone: 'abort' },
  failed: { word: 'Could not run', icon: 'sync_problem', tone: 'invalid' },
};

/** How a re-verification in `state` is shown: an icon and a word, the tone only beside them. */
export function lookOfReverification(state: ReverificationState): VerdictLook {
  return LOOKS[state];
}

/** Whether `value` names a re-verification state. */
export function isReverificationState(value: unknown): value is ReverificationState {
  return typeof value === 'string' && (REVERIFICATION_STATES as readonly string[]).includes(value);
}
