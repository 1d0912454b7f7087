import { Routes } from '@angular/router';

import { CHART_PROVIDERS } from '../charts/chart-providers';

export const setupsRoutes: Routes = [
  { path: '', title: 'Setups · Bellkeep', providers: CHART_PROVIDERS, loadComponent: () => import('./setup-list').then((m) => m.SetupList) },
];
