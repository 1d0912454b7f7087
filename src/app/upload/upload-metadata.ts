import { RESUMABLE_METADATA_KEYS, type StationName } from '@shared/api';
import type { ColumnMapping } from '@shared/analysis';

/** What the browser sends with a log. */
export interface LogUpload {
  log: File;
  setupId: number;
  mapping: ColumnMapping;
  /** The booking the log joins; null: none to join, so the run is unbooked. */
  bookingId: number | null;
  /** Why the log replaces the booking's earlier one; empty for a first log. */
  replacementReason: string;
  /** YYYY-MM-DD, or empty: the booking's night, or none. */
  acquiredOn: string;
  notes: string;
  /** The station whose own log this is; absent for a joined log. */
  station?: StationName;
}

/** A resumable upload's metadata: every value text, as tus carries it. */
export type UploadMetadata = Partial<Record<(typeof RESUMABLE_METADATA_KEYS)[number], string>>;

/** The upload's fields as tus metadata, empty ones left out (the server reads a missing key as not given). */
export function uploadMetadata(upload: LogUpload): UploadMetadata {
  const metadata: UploadMetadata = {
    filename: upload.log.name,
    setupId: String(upload.setupId),
    bookingId: upload.bookingId === null ? '' : String(upload.bookingId),
    acquiredOn: upload.acquiredOn,
    notes: upload.notes,
    mapping: JSON.stringify(upload.mapping),
    replacementReason: upload.replacementReason.trim(),
    station: upload.station ?? '',
  };
  return Object.fromEntries(Object.entries(metadata).filter(([, value]) => value !== ''));
}
