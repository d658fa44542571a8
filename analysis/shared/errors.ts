/** Why a log could not be analysed. Each code has one meaning; the message says what and where. */
export type LogErrorCode =
  | "empty_file"
  | "file_too_large"
  | "too_many_rows"
  | "no_header"
  | "no_time_column"
  | "no_pressure_column"
  | "unknown_unit"
  | "bad_time"
  | "too_few_readings"
  | "invalid_option";

/** The only error the analysis throws on bad input. Anything else escaping is a bug. */
export class LogError extends Error {
  readonly code: LogErrorCode;
  /** 1-based line in the file, when the problem has one. */
  readonly line: number | null;
  /** Column header or index, when the problem has one. */
  readonly column: string | null;

  constructor(code: LogErrorCode, message: string, where: { line?: number; column?: string } = {}) {
    super(message);
    this.name = "LogError";
    this.code = code;
    this.line = where.line ?? null;
    this.column = where.column ?? null;
  }
}
