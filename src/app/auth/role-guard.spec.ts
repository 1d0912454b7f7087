import { Component } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';

import type { Role } from '@shared/api';
import { requireRoles, requireSignIn } from './role-guard';
import { signInAs } from '../../testing/sign-in-as';

@Component({ template: '' })
class Blank {}

describe('role guards', () => {
  let router: Router;

  const signInAsCleo = (roles: Role[]) => signInAs(roles, { id: 9, name: 'Cleo Vance', email: 'cleo.vance@kestrelfen.example' });

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([
          { path: 'sign-in', component: Blank },
          { path: 'forbidden', component: Blank },
          {
            path: '',
            canActivate: [requireSignIn],
            children: [
              { path: '', component: Blank },
              { path: 'users', component: Blank, canActivate: [requireRoles(['admin'])] },
              { path: 'trail', component: Blank, canActivate: [requireRoles(['admin', 'auditor'])] },
            ],
          },
        ]),
      ],
    });
    router = TestBed.inject(Router);
  });

  it('sends a visitor who is not signed in to sign-in, remembering the page', async () => {
    await router.navigateByUrl('/users');
    expect(router.url).toBe('/sign-in?returnUrl=%2Fusers');
  });

  it('lets a user with the role open the page', async () => {
    signInAsCleo(['admin']);
    await router.navigateByUrl('/users');
    expect(router.url).toBe('/users');
  });

  it('lets a user with any one of the allowed roles open the page', async () => {
    signInAsCleo(['experimentalist', 'auditor']);
    await router.navigateByUrl('/trail');
    expect(router.url).toBe('/trail');
  });

  it('refuses a user without the role and names the roles that may open it', async () => {
    signInAsCleo(['experimentalist']);
    await router.navigateByUrl('/trail');
    expect(router.url).toBe('/forbidden?page=%2Ftrail&roles=admin,auditor');
  });

  it('lets any signed-in user open pages without a role check', async () => {
    signInAsCleo(['shift-lead']);
    await router.navigateByUrl('/');
    expect(router.url).toBe('/');
  });
});
