import { z } from 'zod';
import { parseColumnMapping } from '@shared/analysis';
import { acquisitionDate, queryId as positiveId, STATIONS } from '@shared/api';

/** The fields of an upload besides the log: the multipart form's, or a resumable upload's metadata. */
export const uploadFieldsSchema = z.strictObject({
  setupId: positiveId('a setup'),
  bookingId: positiveId('a booking').optional(),
  replacementReason: z.string().trim().max(2000, 'must be at most 2000 characters').optional(),
  profileId: positiveId('a profile').optional(),
  profileVersionId: positiveId('a profile version').optional(),
  mapping: z
    .string()
    .optional()
    .transform((text, context) => {
      if (text === undefined || text.trim() === '') return undefined;
      let value: unknown;
      try {
        value = JSON.parse(text);
      } catch {
        context.addIssue({ code: 'custom', message: 'is not valid JSON' });
        return z.NEVER;
      }
      const parsed = parseColumnMapping(value);
      if (!parsed.ok) {
        context.addIssue({ code: 'custom', message: parsed.message });
        return z.NEVER;
      }
      return parsed.mapping;
    }),
  // Refused with its own message, not as an unknown field: whoever could choose the seed could draw
  // seeds until one passes.
  seed: z.never({ error: 'is drawn by the server, never by the uploader: whoever chooses the seed chooses the test rounds' }).optional(),
  acquiredOn: acquisitionDate.optional(),
  notes: z.string().max(4000, 'must be at most 4000 characters').optional(),
  // A station's own log (A: round, x, a; B: round, y, b), joined with the other station's once both are in.
  station: z.enum(STATIONS, { error: 'must be A or B: the station whose own log this is' }).optional(),
});

export type UploadFields = z.infer<typeof uploadFieldsSchema>;
