// The one error type of the app. A code such as "forbidden:study" names the kind and the subject;
// the HTTP status follows from the kind, so every route answers the same way for the same failure.

export const errorKinds = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  /** A quota of the team is used up (queued runs): 409 like a conflict, told apart by its code. */
  limit: 409,
  payload_too_large: 413,
  rate_limited: 429,
  internal: 500,
  unavailable: 503,
} as const;
export type ErrorKind = keyof typeof errorKinds;
export type ErrorCode = `${ErrorKind}:${string}`;

/** One field-level problem, e.g. { path: "title", message: "Title is required" }. */
export interface FieldIssue {
  path: string;
  message: string;
}

export interface ErrorBody {
  error: { code: ErrorCode; message: string; issues?: FieldIssue[] };
}

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly issues: FieldIssue[] | undefined;

  constructor(code: ErrorCode, message: string, issues?: FieldIssue[]) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.issues = issues;
  }

  get kind(): ErrorKind {
    return this.code.split(":")[0] as ErrorKind;
  }

  get status(): number {
    return errorKinds[this.kind];
  }

  toBody(): ErrorBody {
    return { error: { code: this.code, message: this.message, ...(this.issues ? { issues: this.issues } : {}) } };
  }
}

export function isErrorBody(value: unknown): value is ErrorBody {
  if (typeof value !== "object" || value === null || !("error" in value)) return false;
  const error = (value as { error: unknown }).error;
  return typeof error === "object" && error !== null && "code" in error && "message" in error;
}
