import { z } from 'zod';

/** Where a run is in its life. */
export const RUN_STATES = ['queued', 'analysing', 'accepted', 'aborted', 'invalid', 'failed'] as const;
export type RunState = (typeof RUN_STATES)[number];
export const runStateSchema = /* @__PURE__ */ z.enum(RUN_STATES);

/** States after which nothing more happens to a run's result. */
export const FINISHED_STATES: readonly RunState[] = ['accepted', 'aborted', 'invalid', 'failed'];

export const VERDICTS = ['ACCEPT', 'ABORT', 'INVALID'] as const;
export type Verdict = (typeof VERDICTS)[number];
export const verdictSchema = /* @__PURE__ */ z.enum(VERDICTS);

/** The state a run ends in for each verdict. */
export const STATE_OF_VERDICT = { ACCEPT: 'accepted', ABORT: 'aborted', INVALID: 'invalid' } as const satisfies Record<Verdict, RunState>;

/** States of a run whose verdict is in (and which a shift lead may sign off). */
export const VERDICT_STATES: readonly RunState[] = Object.values(STATE_OF_VERDICT);
