import { z } from 'zod';
import { columnMappingSchema } from '../analysis/log/column-mapping';

/** A shift lead assigned to a setup. */
export const setupShiftLeadSchema = /* @__PURE__ */ z.object({ id: z.number().int(), name: z.string(), email: z.string() }).meta({ id: 'SetupShiftLeadDto' });
export type SetupShiftLeadDto = z.infer<typeof setupShiftLeadSchema>;

/** One two-station experiment. */
export const setupSchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    name: z.string(),
    description: z.string(),
    stationALabel: z.string(),
    stationBLabel: z.string(),
    defaultProfileId: z.number().int(),
    defaultProfileName: z.string(),
    shiftLeads: z.array(setupShiftLeadSchema),
    extraRecipients: z.array(z.string()).meta({ description: 'Further addresses that get the verdict mail.' }),
    fourEyes: z.boolean().meta({ description: 'Whoever uploaded a run may not sign it off (on unless an admin turns it off).' }),
    columnMapping: columnMappingSchema.nullable().meta({
      description: "The saved column mapping of the setup's logs: the upload page starts from it, and an upload naming none is read with it. Null: each header's own names.",
    }),
    stationDistanceM: z.number().nullable().meta({ description: 'Straight-line distance between the stations, metres (the timing check of two station logs); null: unknown.' }),
    clockOffsetNs: z.number().nullable().meta({ description: "Station B's clock minus station A's at the same instant, ns; null: unknown." }),
    clockUncertaintyNs: z.number().nullable().meta({ description: 'The uncertainty of the clock offset, ns (counted against the lab in the timing check).' }),
    createdAt: z.string(),
  })
  .meta({ id: 'SetupDto' });
export type SetupDto = z.infer<typeof setupSchema>;

const label = /* @__PURE__ */ z.string().trim().min(1, 'is required').max(120);

/** Body of `POST /api/setups` and `PUT /api/setups/:id` (admin). */
export const saveSetupRequestSchema = /* @__PURE__ */ z
  .strictObject({
    name: label,
    description: z.string().trim().max(2000).optional(),
    stationALabel: label,
    stationBLabel: label,
    defaultProfileId: z.number({ error: 'must be a profile id' }).int().positive(),
    shiftLeadIds: z.array(z.number().int().positive(), { error: 'must be a list of user ids' }).max(50).meta({ description: 'Users holding the shift-lead role.' }),
    extraRecipients: z
      .array(z.string().trim().pipe(z.email('is not an e-mail address')))
      .max(50)
      .optional(),
    fourEyes: z.boolean({ error: 'must be true or false' }).optional().meta({ description: 'The four-eyes rule; left out: on for a new setup, unchanged for an existing one.' }),
    stationDistanceM: z
      .number({ error: 'must be a number of metres' })
      .positive('must be above 0')
      .max(1e9, 'must be at most 10⁹ m')
      .nullable()
      .optional()
      .meta({ description: 'Metres; null: unknown; left out: unknown for a new setup, unchanged for an existing one.' }),
    clockOffsetNs: z
      .number({ error: 'must be a number of nanoseconds' })
      .min(-1e12, 'must be within ±10¹² ns')
      .max(1e12, 'must be within ±10¹² ns')
      .nullable()
      .optional()
      .meta({ description: "Station B's clock minus A's, ns; given with clockUncertaintyNs or not at all." }),
    clockUncertaintyNs: z.number({ error: 'must be a number of nanoseconds' }).min(0, 'must be 0 or more').max(1e12).nullable().optional(),
  })
  .refine((body) => (body.clockOffsetNs ?? null) === null || (body.clockUncertaintyNs ?? null) !== null, {
    path: ['clockUncertaintyNs'],
    message: 'is required with a clock offset: how well the clocks were compared',
  })
  .refine((body) => (body.clockUncertaintyNs ?? null) === null || (body.clockOffsetNs ?? null) !== null, {
    path: ['clockOffsetNs'],
    message: 'is required with a clock uncertainty',
  })
  .meta({ id: 'SaveSetupRequest' });
export type SaveSetupRequest = z.infer<typeof saveSetupRequestSchema>;

/** Body of `PUT /api/setups/:id/column-mapping` (experimentalists and admins): the mapping to save, or null to forget it. */
export const saveColumnMappingRequestSchema = /* @__PURE__ */ z.strictObject({ mapping: columnMappingSchema.nullable() }).meta({ id: 'SaveColumnMappingRequest' });
export type SaveColumnMappingRequest = z.infer<typeof saveColumnMappingRequestSchema>;
