import { SIGN_OFF_DECISION_WORDS, type LedgerCellDto } from '@shared/api';
import { lookOfState, type VerdictTone } from '../runs/verdict-look';

/** What one cell of the ledger shows: a shape and a word (never the colour alone), and what it opens. */
export interface CellLook {
  icon: string;
  word: string;
  tone: VerdictTone | 'booked';
  /** "2 logs", "awaiting sign-off", "key kept": the small line under the word. */
  note: string;
  /** The cell's full sentence, for screen readers and the tooltip. */
  label: string;
  /** The run it opens, or null for a booked night without a log (it opens the setup). */
  runId: number | null;
}

/** The sign-off under a verdict, in a word (the legend and each cell's label say it in full). */
export const DECISION_NOTES = { 'key-kept': 'kept', 'key-discarded': 'discarded', 'hardware-action': 'hardware' } as const;
export const AWAITING_NOTE = 'to sign';

/** The look of a setup's night in the ledger. */
export function lookOfCell(cell: LedgerCellDto, setupName: string): CellLook {
  const night = `${setupName}, night of ${cell.night}`;
  const run = cell.run;
  if (run === null) {
    return { icon: 'event_available', word: 'Booked', tone: 'booked', note: 'no log yet', label: `${night}: booked, no log yet`, runId: null };
  }
  const look = lookOfState(run.state);
  const attempts = cell.attempts > 1 ? `${cell.attempts} logs` : '';
  if (run.withdrawn) {
    const note = [attempts, look.word].filter(Boolean).join(' · ');
    return { icon: 'undo', word: 'Withdrawn', tone: 'pending', note, label: `${night}: the log (${look.word}) was withdrawn as a mistaken upload`, runId: run.id };
  }
  const signOff = run.decision !== null ? DECISION_NOTES[run.decision] : run.verdict !== null ? AWAITING_NOTE : '';
  const spoken = run.decision !== null ? SIGN_OFF_DECISION_WORDS[run.decision].toLowerCase() : run.verdict !== null ? 'awaiting sign-off' : '';
  const note = [attempts, signOff].filter(Boolean).join(' · ');
  const said = [attempts, spoken].filter(Boolean).join(', ');
  return {
    icon: look.icon,
    word: look.word,
    tone: look.tone,
    note,
    label: `${night}: ${look.word}${said ? `, ${said}` : ''}${cell.bookingId === null ? ', unbooked' : ''}`,
    runId: run.id,
  };
}
