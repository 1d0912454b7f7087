import { z } from 'zod';

const profileParameters = /* @__PURE__ */ z
  .record(z.string(), z.unknown(), { error: 'must be an object of profile fields' })
  .meta({ description: "The engine's profile (see shared/analysis/profile.ts); the server checks it and fills in the defaults." });

/** One fixed version of an acceptance profile: the engine's parameters, defaults filled in. */
export const profileVersionSchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    profileId: z.number().int(),
    version: z.number().int(),
    parameters: profileParameters,
    note: z.string(),
    createdBy: z.string().nullable(),
    createdAt: z.string(),
    usedByRuns: z.number().int().meta({ description: 'Whether any run used this version (it could never change anyway; this says it matters).' }),
  })
  .meta({ id: 'ProfileVersionDto' });
export type ProfileVersionDto = z.infer<typeof profileVersionSchema>;

/** An acceptance profile with every version, newest first. */
export const profileSchema = /* @__PURE__ */ z
  .object({
    id: z.number().int(),
    name: z.string(),
    description: z.string(),
    latestVersionId: z.number().int(),
    versions: z.array(profileVersionSchema),
    createdAt: z.string(),
  })
  .meta({ id: 'ProfileDto' });
export type ProfileDto = z.infer<typeof profileSchema>;

const note = /* @__PURE__ */ z.string().trim().max(2000).optional();

/** Body of `POST /api/profiles` (admin): a new profile with its first version. */
export const createProfileRequestSchema = /* @__PURE__ */ z
  .strictObject({ name: z.string().trim().min(1, 'is required').max(120), description: z.string().trim().max(2000).optional(), parameters: profileParameters, note })
  .meta({ id: 'CreateProfileRequest' });
export type CreateProfileRequest = z.infer<typeof createProfileRequestSchema>;

/** Body of `POST /api/profiles/:id/versions` (admin): editing a profile writes a new version. */
export const createProfileVersionRequestSchema = /* @__PURE__ */ z.strictObject({ parameters: profileParameters, note }).meta({ id: 'CreateProfileVersionRequest' });
export type CreateProfileVersionRequest = z.infer<typeof createProfileVersionRequestSchema>;
