import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { Role } from '@shared/api';
import { Session } from '../app/auth/session';

/** Who a spec signs in as; the token is `token-<first name in lower case>`. */
export interface SpecPerson {
  id: number;
  name: string;
  email: string;
}

/** Someone of the invented lab, when a spec needs no one in particular. */
export const SOMEONE: SpecPerson = { id: 7, name: 'Someone', email: 'someone@kestrelfen.example' };

/**
 * Signs the session in as `person` holding `roles`, answering the sign-in request itself: the test
 * bed must provide the HTTP testing backend.
 */
export function signInAs(roles: Role[], person: SpecPerson = SOMEONE): void {
  TestBed.inject(Session).signIn({ email: person.email, password: 'fen-demo-2026' }).subscribe();
  TestBed.inject(HttpTestingController)
    .expectOne('/api/auth/login')
    .flush({
      token: `token-${person.name.split(' ')[0].toLowerCase()}`,
      expiresAt: '2027-03-16T18:00:00Z',
      user: { ...person, roles, active: true, createdAt: '2026-10-01T08:00:00Z' },
    });
}
