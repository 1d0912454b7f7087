import { FIELD_MEANING } from '../log/round-fields';

/** The two stations of a link: A writes `round,x,a`, B writes `round,y,b`, each with optional times. */
export type Station = 'A' | 'B';

/** The fields of one station record, in the order problems are reported within a row. */
export const STATION_FIELDS = ['round', 'setting', 'outcome', 'settingTime', 'outcomeTime'] as const;

/** One field of a station record. */
export type StationField = (typeof STATION_FIELDS)[number];

/** The two time fields: a station log has both or neither. */
export const TIME_FIELDS: readonly StationField[] = ['settingTime', 'outcomeTime'];

/** The fields every station log must have. */
export const REQUIRED_STATION_FIELDS: readonly StationField[] = ['round', 'setting', 'outcome'];

/**
 * The header name of each field in each station's log: the trade's notation for the settings and
 * outcomes (x, a at station A; y, b at station B), the round index as in a joined log.
 */
export const STATION_COLUMNS: Record<Station, Record<StationField, string>> = {
  A: { round: 'round', setting: 'x', outcome: 'a', settingTime: 't_setting', outcomeTime: 't_outcome' },
  B: { round: 'round', setting: 'y', outcome: 'b', settingTime: 't_setting', outcomeTime: 't_outcome' },
};

/** Allowed settings, as in a joined log: x ∈ {0, 1}; y ∈ {0, 1, 2} (y = 2 is the key setting). */
export const ALLOWED_SETTINGS: Record<Station, readonly number[]> = { A: [0, 1], B: [0, 1, 2] };

/** The rule for each station's setting, as its problems state it (the joined log's words). */
export const SETTING_RULE: Record<Station, string> = { A: 'must be 0 or 1', B: 'must be 0, 1 or 2' };

/** The other station. */
export function otherStation(station: Station): Station {
  return station === 'A' ? 'B' : 'A';
}

/** What each field of a station's log holds, for messages ("station B setting", "station A outcome time"). */
export function stationFieldMeaning(station: Station, field: StationField): string {
  switch (field) {
    case 'round':
      return FIELD_MEANING.round;
    case 'setting':
      return FIELD_MEANING[station === 'A' ? 'x' : 'y'];
    case 'outcome':
      return FIELD_MEANING[station === 'A' ? 'a' : 'b'];
    case 'settingTime':
      return `station ${station} setting time`;
    case 'outcomeTime':
      return `station ${station} outcome time`;
  }
}
