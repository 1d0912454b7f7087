import { Routes } from '@angular/router';

import { CHART_PROVIDERS } from '../charts/chart-providers';
import { GENERAL_PLAN_WORKER, GeneralPlanRunner } from './general-plan-runner';

export const plannerRoutes: Routes = [
  {
    path: '',
    title: 'Round-budget planner · Bellkeep',
    providers: [
      ...CHART_PROVIDERS,
      GeneralPlanRunner,
      { provide: GENERAL_PLAN_WORKER, useValue: () => new Worker(new URL('./general-plan.worker', import.meta.url), { type: 'module' }) },
    ],
    loadComponent: () => import('./planner-page').then((m) => m.PlannerPage),
  },
];
