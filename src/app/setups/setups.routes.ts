import { Routes } from '@angular/router';

import { CHART_PROVIDERS } from '../charts/chart-providers';

export const setupsRoutes: Routes = [
  {
    path: '',
    providers: CHART_PROVIDERS,
    children: [
      { path: '', title: 'Setups · Bellkeep', loadComponent: () => import('./setup-list').then((m) => m.SetupList) },
      { path: ':id', title: 'Setup · Bellkeep', loadComponent: () => import('./setup-page').then((m) => m.SetupPage) },
    ],
  },
];
