import { CHECK_FAMILIES } from '@shared/analysis';
import { CHECK_FAMILY_LABELS } from '@shared/format/check-labels';

/** The check families in order, with their words, as the profile dialog offers them. */
export const CHECK_FAMILY_OPTIONS = CHECK_FAMILIES.map((family) => ({ value: family, label: CHECK_FAMILY_LABELS[family] }));
