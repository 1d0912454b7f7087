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
    columnMapping: columnMappingSchema
      .nullable()
      .meta({
        description: "The saved column mapping of the setup's logs: the upload page starts from it, and an upload naming none is read with it. Null: each header's own names.",
      }),
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
  })
  .meta({ id: 'SaveSetupRequest' });
export type SaveSetupRequest = z.infer<typeof saveSetupRequestSchema>;

/** Body of `PUT /api/setups/:id/column-mapping` (experimentalists and admins): the mapping to save, or null to forget it. */
export const saveColumnMappingRequestSchema = /* @__PURE__ */ z.strictObject({ mapping: columnMappingSchema.nullable() }).meta({ id: 'SaveColumnMappingRequest' });
export type SaveColumnMappingRequest = z.infer<typeof saveColumnMappingRequestSchema>;
