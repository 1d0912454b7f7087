import { inject, Injectable, InjectionToken } from '@angular/core';
import { Observable } from 'rxjs';

import type { GeneralAttackPlanDto } from '@shared/api';
import type { GeneralPlanPart, GeneralPlanStep, GeneralPlanTask } from './general-plan-steps';

/** What the page needs of a worker: `Worker` itself in the app, an in-process one in tests. */
export type GeneralPlanWorker = Pick<Worker, 'postMessage' | 'terminate'> & { onmessage: ((event: MessageEvent<WorkerReply>) => void) | null };

/** Starts one planner worker (provided with the planner's routes: `new Worker(new URL(…))`). */
export const GENERAL_PLAN_WORKER = new InjectionToken<() => GeneralPlanWorker>('general-plan worker');

/** What a worker posts. */
export type WorkerReply = { step: GeneralPlanStep } | { done: true } | { failed: string };

/** The general-attack plan as far as it is known. */
export type GeneralPlanProgress = { status: 'computing' | 'ready'; plan: Partial<GeneralAttackPlanDto> } | { status: 'unavailable' | 'failed'; message: string };

const PARTS: GeneralPlanPart[] = ['rounds', 'gamma'];

/** Runs the general-attack plan in workers, one per part, and gathers their steps as they come. */
@Injectable()
export class GeneralPlanRunner {
  private readonly startWorker = inject(GENERAL_PLAN_WORKER);

  /** The plan's progress; unsubscribing stops the workers (a newer input makes the old plan moot). */
  run(task: Omit<GeneralPlanTask, 'part'>): Observable<GeneralPlanProgress> {
    return new Observable<GeneralPlanProgress>((subscriber) => {
      let plan: Partial<GeneralAttackPlanDto> = {};
      let running = PARTS.length;
      const workers = PARTS.map((part) => {
        const worker = this.startWorker();
        worker.onmessage = ({ data }) => {
          if ('failed' in data) return subscriber.next({ status: 'failed', message: data.failed });
          if ('done' in data) {
            running -= 1;
            if (running === 0) subscriber.next({ status: 'ready', plan });
            return;
          }
          if ('unavailable' in data.step) return subscriber.next({ status: 'unavailable', message: data.step.unavailable });
          plan = { ...plan, ...data.step };
          subscriber.next({ status: 'computing', plan });
        };
        worker.postMessage({ ...task, part } satisfies GeneralPlanTask);
        return worker;
      });
      subscriber.next({ status: 'computing', plan });
      return () => workers.forEach((worker) => worker.terminate());
    });
  }
}
