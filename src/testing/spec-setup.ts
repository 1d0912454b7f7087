import type { SetupDto } from '@shared/api';

/** A setup of the invented lab as the API sends it: the Fen link, North Hall to Mill Lane, unless `changes` say otherwise. */
export function specSetup(changes: Partial<SetupDto> = {}): SetupDto {
  return {
    id: 2,
    name: 'Fen link',
    description: '',
    stationALabel: 'North Hall',
    stationBLabel: 'Mill Lane',
    defaultProfileId: 1,
    defaultProfileName: 'Nightly standard',
    shiftLeads: [],
    extraRecipients: [],
    fourEyes: true,
    columnMapping: null,
    stationDistanceM: null,
    clockOffsetNs: null,
    clockUncertaintyNs: null,
    createdAt: '2026-11-01T08:00:00Z',
    ...changes,
  };
}
