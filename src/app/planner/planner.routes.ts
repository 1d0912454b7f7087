import { Routes } from '@angular/router';

import { CHART_PROVIDERS } from '../charts/chart-providers';

export const plannerRoutes: Routes = [
  { path: '', title: 'Round-budget planner · Bellkeep', providers: CHART_PROVIDERS, loadComponent: () => import('./planner-page').then((m) => m.PlannerPage) },
];
