/** The one JSON shape of every API error. */
export interface ApiErrorBody {
  error: {
    /** Stable machine-readable kind, e.g. `validation`, `unauthorized`, `forbidden`, `not-found`. */
    code: ApiErrorCode;
    /** A sentence for people. */
    message: string;
    /** For validation errors: the offending field as a dotted path, e.g. `roles.1`. */
    field?: string;
  };
}

export type ApiErrorCode =
  | 'validation'
  | 'unauthorized'
  | 'forbidden'
  | 'not-found'
  | 'conflict'
  | 'rate-limited'
  | 'busy'
  | 'insufficient-storage'
  | 'internal';
