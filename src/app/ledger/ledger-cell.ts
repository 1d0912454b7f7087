import { SIGN_OFF_DECISION_WORDS, type LedgerCellDto } from '@shared/api';
import { lookOfState, type VerdictTone } from '../runs/verdict-look';
import { shownDate } from '../dates/shown-dates';

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
  const night = `${setupName}, night of ${shownDate(cell.night, 'day')}`;
  const run = cell.run;
  if (run === null && cell.waitingFor !== null) {
    const note = `waits for ${cell.waitingFor}`;
    const inFull = `station ${cell.waitingFor === 'A' ? 'B' : 'A'}'s log is in; the night waits for station ${cell.waitingFor}'s`;
    return { icon: 'hourglass_top', word: 'One log', tone: 'booked', note, label: spoken(night, 'One log', [note], inFull), runId: null };
  }
  if (run === null) {
    return { icon: 'event_available', word: 'Booked', tone: 'booked', note: 'no log yet', label: spoken(night, 'Booked', ['no log yet'], ''), runId: null };
  }
  const look = lookOfState(run.state);
  const attempts = cell.attempts > 1 ? `${cell.attempts} logs` : '';
  if (run.withdrawn) {
    const notes = [attempts, look.word].filter(Boolean);
    return {
      icon: 'undo',
      word: 'Withdrawn',
      tone: 'pending',
      note: notes.join(' · '),
      label: spoken(night, 'Withdrawn', notes, 'the log was withdrawn as a mistaken upload'),
      runId: run.id,
    };
  }
  const signOff = run.decision !== null ? DECISION_NOTES[run.decision] : run.verdict !== null ? AWAITING_NOTE : '';
  const signOffInFull = run.decision !== null ? `signed off: ${SIGN_OFF_DECISION_WORDS[run.decision].toLowerCase()}` : run.verdict !== null ? 'awaiting sign-off' : '';
  const notes = [attempts, signOff].filter(Boolean);
  return {
    icon: look.icon,
    word: look.word,
    tone: look.tone,
    note: notes.join(' · '),
    label: spoken(night, look.word, notes, signOffInFull) + (cell.bookingId === null ? ', unbooked' : ''),
    runId: run.id,
  };
}

/**
 * A cell's full sentence: the night, then the words the cell shows in their order (so a screen
 * reader's name holds the visible words, as speech input needs), then the short notes in full.
 */
function spoken(night: string, word: string, notes: string[], inFull: string): string {
  return `${night}: ${[word, ...notes].join(', ')}${inFull ? ` (${inFull})` : ''}`;
}
