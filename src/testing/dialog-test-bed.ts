import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { Provider } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';

/** The test bed of a component that talks to the API: the HTTP testing backend (returned), no animations, and `providers`. */
export function configureApiTestBed(providers: Provider[] = []): HttpTestingController {
  TestBed.configureTestingModule({
    providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }, ...providers],
  });
  return TestBed.inject(HttpTestingController);
}

/**
 * The test bed of a dialog component opened with `data`: the HTTP testing backend (returned), no
 * animations, and a dialog reference whose `close` is the spec's own function.
 */
export function configureDialogTestBed(data: unknown, close: (result?: unknown) => void): HttpTestingController {
  return configureApiTestBed([
    { provide: MAT_DIALOG_DATA, useValue: data },
    { provide: MatDialogRef, useValue: { close } },
  ]);
}
