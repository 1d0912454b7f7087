import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatExpansionModule } from '@angular/material/expansion';

import type { SecuritySummary } from '@shared/analysis';
import { formatCount, formatScientific } from '@shared/format/numbers';
import { KeyCaution } from './key-caution';

/** The key figure each attack model stands for, in words. */
const MODEL_WORDS: Record<SecuritySummary['model'], string> = {
  collective: 'collective (i.i.d.) attacks: the finite key estimate',
  general: 'general attacks: the key length by entropy accumulation',
};

/** The ε bookkeeping of a run: what the key figure that counts rests on, and how the checks share the significance. */
@Component({
  selector: 'bk-security-parameters',
  imports: [KeyCaution, MatExpansionModule],
  templateUrl: './security-parameters.html',
  styleUrl: './security-parameters.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SecurityParameters {
  /** The result's security summary. */
  readonly security = input.required<SecuritySummary>();

  protected readonly model = computed(() => MODEL_WORDS[this.security().model]);
  protected readonly keyEpsilon = computed(() => formatScientific(this.security().keyEpsilon));
  protected readonly terms = computed(() => this.security().terms.map((term) => ({ ...term, value: formatScientific(term.value) })));
  protected readonly sharing = computed(() => {
    const { significance, count, perCheck } = this.security().checks;
    return { significance: formatScientific(significance), count: formatCount(count), perCheck: formatScientific(perCheck) };
  });
}
