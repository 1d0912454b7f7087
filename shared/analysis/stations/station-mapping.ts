import { ColumnMapping, OutcomeEncoding } from '../log/column-mapping';
import { STATION_COLUMNS } from './station-columns';

const A = STATION_COLUMNS.A;
const B = STATION_COLUMNS.B;

/** Why a station log takes no column names from a mapping. */
export const STATION_MAPPING_RULE =
  `a station log is read by its own column names (station A: ${A.round}, ${A.setting}, ${A.outcome}; station B: ${B.round}, ${B.setting}, ${B.outcome}; ` +
  `both optionally ${A.settingTime}, ${A.outcomeTime}); only "outcomes" can be given`;

/**
 * How a pair of station logs writes its outcomes, from a (validated) column mapping: the only part
 * of a mapping a station log takes. Null, with `STATION_MAPPING_RULE` to say why, when the mapping
 * names columns.
 */
export function stationLogOutcomes(mapping: ColumnMapping): OutcomeEncoding | null {
  return Object.keys(mapping.columns).length > 0 ? null : mapping.outcomes;
}
