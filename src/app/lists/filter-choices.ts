import { computed, inject, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { catchError, of } from 'rxjs';

import { VERDICTS, type Verdict } from '@shared/api';
import { lookOfVerdict } from '../runs/verdict-look';
import { SetupsApi } from '../setups/setups-api';
import type { FilterChoice } from './choice-filter';

/** The verdicts, in their words, as filter choices. */
export const VERDICT_CHOICES: readonly FilterChoice<Verdict>[] = VERDICTS.map((verdict) => ({ value: verdict, label: lookOfVerdict(verdict).word }));

/** The lab's setups as filter choices (none when they cannot be loaded: the list still works). Call in an injection context. */
export function setupChoices(): Signal<FilterChoice<number>[]> {
  const setups = toSignal(
    inject(SetupsApi)
      .list()
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );
  return computed(() => setups().map((setup) => ({ value: setup.id, label: setup.name })));
}
