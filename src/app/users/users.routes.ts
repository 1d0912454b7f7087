import { Routes } from '@angular/router';

export const usersRoutes: Routes = [{ path: '', loadComponent: () => import('./user-list').then((m) => m.UserList) }];
