import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { ApplicationConfig, inject, provideAppInitializer, provideBrowserGlobalErrorListeners, provideZonelessChangeDetection } from '@angular/core';
import { MatIconRegistry } from '@angular/material/icon';
import { MatPaginatorIntl } from '@angular/material/paginator';
import { provideRouter, withComponentInputBinding } from '@angular/router';

import { PageWords } from './api/page-words';
import { routes } from './app.routes';
import { authInterceptor } from './auth/auth-interceptor';
import { Session } from './auth/session';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideHttpClient(withInterceptors([authInterceptor])),
    provideRouter(routes, withComponentInputBinding()),
    { provide: MatPaginatorIntl, useClass: PageWords },
    // mat-icon would otherwise use the `material-icons` class, which we do not ship.
    provideAppInitializer(() => {
      inject(MatIconRegistry).setDefaultFontSetClass('material-symbols-outlined');
    }),
    // The guards decide on the user's roles, so a kept token is checked before the first route.
    provideAppInitializer(() => inject(Session).restore()),
  ],
};
