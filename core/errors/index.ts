// Typed errors: every error Whence throws on purpose carries a stable code and a message a user can act on.
// Callers branch on `code`; the message is for people and says what is wrong and what to do.

export class WhenceError extends Error {
  readonly code: string;

  constructor(code: string, message: string) {
    super(message);
    this.name = 'WhenceError';
    this.code = code;
  }
}

/** True when `value` is an error Whence raised on purpose (as opposed to a bug). */
export function isWhenceError(value: unknown): value is WhenceError {
  return value instanceof WhenceError;
}
