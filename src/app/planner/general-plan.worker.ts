/// <reference lib="webworker" />
import { generalPlanSteps, type GeneralPlanTask } from './general-plan-steps';

// A planner task in a thread of its own, so the page stays responsive while it runs; each step
// is posted as soon as it is known, then `done`.
addEventListener('message', ({ data }: MessageEvent<GeneralPlanTask>) => {
  try {
    for (const step of generalPlanSteps(data)) postMessage({ step });
    postMessage({ done: true });
  } catch (error) {
    postMessage({ failed: error instanceof Error ? error.message : String(error) });
  }
});
