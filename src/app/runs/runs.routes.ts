import { Routes } from '@angular/router';

import { CHART_PROVIDERS } from '../charts/chart-providers';

export const runsRoutes: Routes = [
  {
    path: '',
    providers: CHART_PROVIDERS,
    children: [
      { path: '', title: 'Runs · Bellkeep', loadComponent: () => import('./run-list').then((m) => m.RunList) },
      { path: ':id', title: 'Run · Bellkeep', loadComponent: () => import('./run-page').then((m) => m.RunPage) },
    ],
  },
];
