import { Router, UrlTree } from '@angular/router';

/** The sign-in page, remembering the page to return to afterwards. */
export function signInUrl(router: Router, returnUrl: string): UrlTree {
  const queryParams = isReturnable(returnUrl) ? { returnUrl } : {};
  return router.createUrlTree(['/sign-in'], { queryParams });
}

/** Whether `url` is a page of this app worth returning to after signing in. */
export function isReturnable(url: string | null | undefined): url is string {
  // Only paths inside the app: `//host` would be read as another site by the browser.
  return !!url && url.startsWith('/') && !url.startsWith('//') && !url.startsWith('/sign-in');
}
