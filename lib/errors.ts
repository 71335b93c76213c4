// One error type for the whole app. The code is `kind:subject`, e.g. `forbidden:species`;
// the kind decides the HTTP status, the subject says what it was about.

export type ErrorKind =
  'bad_request' | 'invalid' | 'unauthorized' | 'forbidden' | 'not_found' | 'conflict' | 'payload_too_large' | 'unsupported_media_type' | 'rate_limited';

const statusOf: Record<ErrorKind, number> = {
  bad_request: 400,
  invalid: 422,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
};

const defaultMessage: Record<ErrorKind, string> = {
  bad_request: 'The request could not be read.',
  invalid: 'Some fields are not valid.',
  unauthorized: 'Please sign in first.',
  forbidden: 'Your role does not allow this.',
  not_found: 'Not found.',
  conflict: 'Someone else changed this first. Reload and try again.',
  payload_too_large: 'That is too large.',
  unsupported_media_type: 'That kind of content is not accepted here.',
  rate_limited: 'Too many attempts. Wait a minute and try again.',
};

export type FieldErrors = Record<string, string[]>;

export class AppError extends Error {
  readonly kind: ErrorKind;
  readonly code: string;
  readonly fields?: FieldErrors;
  readonly status: number;

  constructor(code: `${ErrorKind}:${string}` | ErrorKind, message?: string, fields?: FieldErrors) {
    const kind = code.split(':')[0] as ErrorKind;
    super(message ?? defaultMessage[kind]);
    this.name = 'AppError';
    this.kind = kind;
    this.code = code;
    this.fields = fields;
    this.status = statusOf[kind] ?? 400;
  }

  toBody() {
    return { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}) } };
  }
}

export function isAppError(e: unknown): e is AppError {
  return e instanceof AppError;
}
