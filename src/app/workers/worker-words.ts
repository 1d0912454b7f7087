import type { WorkerCondition } from '@shared/api';

/** Each condition of a worker as an icon and words (never colour alone). */
export const WORKER_CONDITION_WORDS: Record<WorkerCondition, { icon: string; words: string }> = {
  'taking-jobs': { icon: 'play_circle', words: 'Taking jobs' },
  silent: { icon: 'wifi_off', words: 'Silent' },
  stopped: { icon: 'stop_circle', words: 'Stopped' },
  'ended-unasked': { icon: 'error', words: 'Ended unasked' },
};
