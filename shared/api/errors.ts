import { z } from 'zod';

export const API_ERROR_CODES = [
  'validation',
  'unauthorized',
  'forbidden',
  'not-found',
  'conflict',
  'rate-limited',
  'busy',
  'insufficient-storage',
  'mail-failed',
  'internal',
] as const;
export type ApiErrorCode = (typeof API_ERROR_CODES)[number];

/** The one JSON shape of every API error. */
export const apiErrorBodySchema = /* @__PURE__ */ z
  .object({
    error: z.object({
      code: z.enum(API_ERROR_CODES).meta({ description: 'Stable machine-readable kind, e.g. `validation`, `unauthorized`, `forbidden`, `not-found`.' }),
      message: z.string().meta({ description: 'A sentence for people.' }),
      field: z.string().optional().meta({ description: 'For validation errors: the offending field as a dotted path, e.g. `roles.1`.' }),
    }),
  })
  .meta({ id: 'ApiErrorBody' });
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;
