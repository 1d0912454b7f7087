/**
 * A request the engine cannot run: a bad profile, mapping or seed, a file it cannot read, or (two
 * station logs) a stated offset or station geometry it cannot use. Not a verdict on the log.
 */
export class AnalysisRequestError extends Error {
  constructor(
    message: string,
    /** What was wrong. */
    readonly kind: 'profile' | 'mapping' | 'seed' | 'io' | 'stations',
  ) {
    super(message);
    this.name = 'AnalysisRequestError';
  }
}

/** The caller cancelled the analysis through its AbortSignal. */
export class AnalysisCancelledError extends Error {
  constructor() {
    super('the analysis was cancelled');
    this.name = 'AnalysisCancelledError';
  }
}
