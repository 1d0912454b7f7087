/** Progress of an analysis: the bytes of the file read so far in the current pass. */
export interface AnalysisProgress {
  /** `counting`: the first pass (size, hash, line count); `analysing`: the second. */
  phase: 'counting' | 'analysing';
  /** Bytes of the file (as stored, compressed for gzip) read in this pass. */
  bytesRead: number;
  /** Size of the file, or null when a stream of unknown length is read. */
  totalBytes: number | null;
}

/** Receives progress. */
export type ProgressListener = (progress: AnalysisProgress) => void;

/** Adds up bytes for one pass and tells the listener. */
export function progressCounter(phase: AnalysisProgress['phase'], totalBytes: number | null, listener: ProgressListener | undefined): (bytes: number) => void {
  let bytesRead = 0;
  return (bytes) => {
    bytesRead += bytes;
    listener?.({ phase, bytesRead, totalBytes });
  };
}
