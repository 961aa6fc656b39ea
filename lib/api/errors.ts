/**
 * Typed errors shared by server and client: the server maps a code to an HTTP status in
 * one place, and the client fetcher turns a failed response back into the same error.
 */
export const ERROR_STATUS = {
  bad_request: 400,
  validation_failed: 422,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  unavailable: 503,
  internal: 500,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

export interface FieldIssue {
  path: string;
  message: string;
}

export interface ErrorBody {
  error: { code: ErrorCode; message: string; issues?: FieldIssue[] };
}

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly issues?: FieldIssue[];
  readonly headers?: Record<string, string>;

  constructor(code: ErrorCode, message: string, opts: { issues?: FieldIssue[]; headers?: Record<string, string> } = {}) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.issues = opts.issues;
    this.headers = opts.headers;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }

  toBody(): ErrorBody {
    return { error: { code: this.code, message: this.message, ...(this.issues ? { issues: this.issues } : {}) } };
  }
}

export function isErrorBody(value: unknown): value is ErrorBody {
  if (typeof value !== "object" || value === null || !("error" in value)) return false;
  const e = value.error;
  return typeof e === "object" && e !== null && "code" in e && "message" in e;
}
