/** A shift lead assigned to a setup. */
export interface SetupShiftLeadDto {
  id: number;
  name: string;
  email: string;
}

/** One two-station experiment. */
export interface SetupDto {
  id: number;
  name: string;
  description: string;
  stationALabel: string;
  stationBLabel: string;
  defaultProfileId: number;
  defaultProfileName: string;
  shiftLeads: SetupShiftLeadDto[];
  /** Further addresses that get the verdict mail. */
  extraRecipients: string[];
  createdAt: string;
}

/** Body of `POST /api/setups` and `PUT /api/setups/:id` (admin). */
export interface SaveSetupRequest {
  name: string;
  description?: string;
  stationALabel: string;
  stationBLabel: string;
  defaultProfileId: number;
  /** Users holding the shift-lead role. */
  shiftLeadIds: number[];
  extraRecipients?: string[];
}
