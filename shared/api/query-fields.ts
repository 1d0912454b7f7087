import { z } from 'zod';

/**
 * Building blocks of the request contracts. Query values arrive as text, so numbers are coerced;
 * each message completes "<field>: ..." in the 400 answer.
 */
export const isoDate = /* @__PURE__ */ z.iso.date({ error: 'must be a date as YYYY-MM-DD' });
export const isoDateTime = /* @__PURE__ */ z.iso.datetime({ offset: true, error: 'must be an ISO date-time' });

/** A positive id in a query string or form field. */
export const queryId = /* @__NO_SIDE_EFFECTS__ */ (what: string) =>
  z.coerce
    .number({ error: `must be ${what} id` })
    .int()
    .positive({ error: `must be ${what} id` });

/** A positive id in a JSON body. */
export const bodyId = /* @__NO_SIDE_EFFECTS__ */ (what: string) =>
  z
    .number({ error: `must be ${what} id` })
    .int()
    .positive({ error: `must be ${what} id` });

/** A finite number in a query string. */
export const queryNumber = /* @__NO_SIDE_EFFECTS__ */ (what: string) => z.coerce.number({ error: `must be ${what}` }).refine(Number.isFinite, { error: `must be ${what}` });

/** Paging of a list: page from 0, and a page size up to `maxSize`. */
export const paging = /* @__NO_SIDE_EFFECTS__ */ (defaultSize: number, maxSize: number) => ({
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(maxSize).default(defaultSize),
});
