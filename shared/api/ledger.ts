import { z } from 'zod';
import { SIGN_OFF_DECISIONS } from './runs';
import { runStateSchema, verdictSchema } from './run-states';
import { isoDate } from './query-fields';
import { STATIONS } from './stations';

/** Nights the ledger shows at most in one answer. */
export const LEDGER_MAX_NIGHTS = 92;
/** Nights the ledger shows when no range is asked for: the last three weeks, tonight included. */
export const LEDGER_DEFAULT_NIGHTS = 21;

/** The range of `GET /api/ledger`: inclusive nights, YYYY-MM-DD; by default the last three weeks. */
export const ledgerQuerySchema = /* @__PURE__ */ z
  .strictObject({ from: isoDate.optional(), to: isoDate.optional() })
  .meta({ description: `Inclusive nights, at most ${LEDGER_MAX_NIGHTS}; left out: the ${LEDGER_DEFAULT_NIGHTS} nights up to today.` });
export type LedgerQuery = z.infer<typeof ledgerQuerySchema>;

/** One setup's night: its booking, how many logs came, and the latest of them with its sign-off. */
export const ledgerCellSchema = /* @__PURE__ */ z
  .object({
    night: z.string(),
    bookingId: z.number().int().nullable(),
    attempts: z.number().int().meta({ description: 'Logs uploaded for the night (a replaced log counts too).' }),
    run: z
      .object({
        id: z.number().int(),
        state: runStateSchema,
        verdict: verdictSchema.nullable(),
        signedOff: z.boolean(),
        decision: z.enum(SIGN_OFF_DECISIONS).nullable(),
        withdrawn: z.boolean().meta({ description: 'The log was withdrawn as a mistaken upload.' }),
      })
      .nullable()
      .meta({ description: 'The latest log of the night; null for a booked night with none yet.' }),
    waitingFor: z.enum(STATIONS).nullable().meta({ description: "The station whose log the night still waits for: the other station's log is in, and the pair is not yet a run." }),
  })
  .meta({ id: 'LedgerCellDto' });
export type LedgerCellDto = z.infer<typeof ledgerCellSchema>;

/** Every setup, a row each, with the nights that have a booking or a log (the others are empty). */
export const ledgerSchema = /* @__PURE__ */ z
  .object({
    from: z.string(),
    to: z.string(),
    setups: z.array(z.object({ setupId: z.number().int(), name: z.string(), cells: z.array(ledgerCellSchema) })),
  })
  .meta({ id: 'LedgerDto' });
export type LedgerDto = z.infer<typeof ledgerSchema>;

/** One entry of a worklist: a run and what makes it wait. */
export const workItemSchema = /* @__PURE__ */ z
  .object({
    runId: z.number().int(),
    setupName: z.string(),
    night: z.string().nullable(),
    state: runStateSchema,
    verdict: verdictSchema.nullable(),
    note: z.string().meta({ description: 'What the entry waits for, in a few words.' }),
  })
  .meta({ id: 'WorkItemDto' });
export type WorkItemDto = z.infer<typeof workItemSchema>;

/** The worklists, by what they hold. */
export const WORKLIST_KINDS = ['sign-off', 'uploads', 'reverifications'] as const;
export type WorklistKind = (typeof WORKLIST_KINDS)[number];

/** `GET /api/worklist`: the signed-in person's lists, one for each role that has one. */
export const worklistSchema = /* @__PURE__ */ z
  .object({
    lists: z.array(
      z.object({
        kind: z.enum(WORKLIST_KINDS),
        count: z.number().int().meta({ description: 'Entries in all; `items` holds the first few.' }),
        items: z.array(workItemSchema),
      }),
    ),
  })
  .meta({ id: 'WorklistDto' });
export type WorklistDto = z.infer<typeof worklistSchema>;
