import { Routes } from '@angular/router';

import { requireRoles, requireSignIn } from './auth/role-guard';
import { navItem } from './shell/navigation';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Bellkeep',
    loadComponent: () => import('./sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: 'reset-password',
    title: 'Set your password · Bellkeep',
    loadComponent: () => import('./passwords/reset-password').then((m) => m.ResetPassword),
  },
  {
    path: '',
    canActivate: [requireSignIn],
    loadComponent: () => import('./shell/shell').then((m) => m.Shell),
    children: [
      {
        path: '',
        pathMatch: 'full',
        title: 'Overview · Bellkeep',
        loadComponent: () => import('./overview/overview').then((m) => m.Overview),
      },
      {
        path: 'runs',
        loadChildren: () => import('./runs/runs.routes').then((m) => m.runsRoutes),
      },
      {
        path: 'upload',
        title: 'Upload a run · Bellkeep',
        canActivate: [requireRoles(navItem('upload').roles)],
        loadComponent: () => import('./upload/upload-page').then((m) => m.UploadPage),
      },
      {
        path: 'planner',
        canActivate: [requireRoles(navItem('planner').roles)],
        loadChildren: () => import('./planner/planner.routes').then((m) => m.plannerRoutes),
      },
      {
        path: 'setups',
        loadChildren: () => import('./setups/setups.routes').then((m) => m.setupsRoutes),
      },
      {
        path: 'profiles',
        title: 'Acceptance profiles · Bellkeep',
        loadComponent: () => import('./profiles/profile-list').then((m) => m.ProfileList),
      },
      {
        path: 'audit',
        title: 'Audit · Bellkeep',
        canActivate: [requireRoles(navItem('audit').roles)],
        loadComponent: () => import('./audit/audit-page').then((m) => m.AuditPage),
      },
      {
        path: 'users',
        title: 'Users · Bellkeep',
        canActivate: [requireRoles(navItem('users').roles)],
        loadChildren: () => import('./users/users.routes').then((m) => m.usersRoutes),
      },
      {
        path: 'workers',
        title: 'Analysis workers · Bellkeep',
        canActivate: [requireRoles(navItem('workers').roles)],
        loadComponent: () => import('./workers/workers-page').then((m) => m.WorkersPage),
      },
      {
        path: 'forbidden',
        title: 'Not allowed · Bellkeep',
        loadComponent: () => import('./status-pages/forbidden').then((m) => m.Forbidden),
      },
      {
        path: '**',
        title: 'Page not found · Bellkeep',
        loadComponent: () => import('./status-pages/not-found').then((m) => m.NotFound),
      },
    ],
  },
];
