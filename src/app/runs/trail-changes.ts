import { parseColumnMapping } from '@shared/analysis';
import { isRole, ROLE_LABELS } from '@shared/api';
import { savedMappingWords } from '@shared/format/mapping-words';

/** The fields a change line names, in the trail's words. */
const FIELD_WORDS: Record<string, string> = {
  name: 'Name',
  email: 'E-mail',
  roles: 'Roles',
  active: 'Account',
  description: 'Description',
  stationALabel: 'Station A',
  stationBLabel: 'Station B',
  defaultProfile: 'Default profile',
  shiftLeads: 'Shift leads',
  extraRecipients: 'Also mailed',
  fourEyes: 'Four-eyes rule',
  columnMapping: 'Column mapping',
  stationDistanceM: 'Distance between the stations (m)',
  clockOffsetNs: 'Clock offset B − A (ns)',
  clockUncertaintyNs: 'Clock offset uncertainty (ns)',
};

/** One value of a changed field in words: flags by what they mean, lists joined, roles by their labels. */
function valueWords(field: string, value: unknown): string {
  if (field === 'fourEyes') return value === true ? 'on' : 'off';
  if (field === 'columnMapping') {
    const parsed = value === null ? null : parseColumnMapping(value);
    return parsed === null ? 'none' : parsed.ok ? savedMappingWords(parsed.mapping) : '–';
  }
  if (field === 'active') return value === true ? 'active' : 'deactivated';
  if (Array.isArray(value)) return value.length === 0 ? 'none' : value.map((item) => (field === 'roles' && isRole(item) ? ROLE_LABELS[item] : String(item))).join(', ');
  if (typeof value === 'string') return value === '' ? '(empty)' : value;
  return typeof value === 'number' || typeof value === 'boolean' ? String(value) : '–';
}

/**
 * What a change line of the trail changed, field by field ("Four-eyes rule: on → off · Shift
 * leads: Ada Reyes, Lucia Brandt → Lucia Brandt"); "No field changed" for a save that changed nothing.
 */
export function changeWords(changes: Record<string, unknown>): string {
  const lines = Object.entries(changes).flatMap(([field, change]) => {
    if (typeof change !== 'object' || change === null || !('from' in change) || !('to' in change)) return [];
    return [`${FIELD_WORDS[field] ?? field}: ${valueWords(field, change.from)} → ${valueWords(field, change.to)}`];
  });
  return lines.length === 0 ? 'No field changed' : lines.join(' · ');
}
