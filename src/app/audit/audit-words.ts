import { AUDIT_ACTIONS, AUDIT_TARGET_TYPES, type AuditTargetType } from '@shared/api';
import { trailWords } from '../runs/trail-words';

/** What a trail line is about, in words. */
export const TARGET_WORDS: Readonly<Record<AuditTargetType, string>> = {
  run: 'Run',
  user: 'User',
  profile: 'Profile',
  setup: 'Setup',
  booking: 'Booked night',
  'upload-token': 'Upload token',
  'signing-key': 'Report-signing key',
  audit: 'Audit',
};

/** A group of the action filter: the whole family (`run.`) and each of its exact actions. */
export interface ActionFamily {
  /** The family as the API takes it: its noun and a dot. */
  readonly value: string;
  readonly label: string;
  readonly actions: readonly { readonly value: string; readonly label: string }[];
}

/** The nouns of actions recorded against a target of another kind, in words: a station's log is recorded against its setup. */
const OTHER_NOUN_WORDS: Readonly<Record<string, string>> = { 'station-log': 'Station log' };

/** The noun of every action (`run` of `run.exported`), in the order first recorded. */
const ACTION_NOUNS = [...new Set(AUDIT_ACTIONS.map((action) => action.split('.')[0]))];

/**
 * An action's family is the kind of thing it happens to (the API filters by the noun before the
 * dot): one family per target type, then one per other noun.
 */
export const ACTION_FAMILIES: readonly ActionFamily[] = [...AUDIT_TARGET_TYPES, ...ACTION_NOUNS.filter((noun) => !(AUDIT_TARGET_TYPES as readonly string[]).includes(noun))].map(
  (noun) => ({
    value: `${noun}.`,
    label: `Any ${(TARGET_WORDS[noun as AuditTargetType] ?? OTHER_NOUN_WORDS[noun] ?? noun).toLowerCase()} action`,
    actions: AUDIT_ACTIONS.filter((action) => action.startsWith(`${noun}.`)).map((action) => ({ value: action, label: trailWords(action) })),
  }),
);

/** A trail line's target in words: "Run 12", "Report-signing key 5c1e0a9b7d2f4e38", "Audit trail". */
export function targetWords(targetType: string, targetId: string, targetName: string | null = null): string {
  return targetName ?? `${TARGET_WORDS[targetType as AuditTargetType] ?? targetType} ${targetId}`;
}
