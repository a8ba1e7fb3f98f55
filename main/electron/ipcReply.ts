// The envelope of every IPC reply, so a failure reaches the page with its own message (not Electron's
// "Error invoking remote method ..." wrapper): { ok: true, value } or { ok: false, code, message }.

export type IpcReply<T> = { ok: true; value: T } | { ok: false; code: string; message: string };

export function okReply<T>(value: T): IpcReply<T> {
  return { ok: true, value };
}

export function failureReply(code: string, message: string): IpcReply<never> {
  return { ok: false, code, message };
}

/** The value of a reply; a failure (or a malformed reply) becomes an Error carrying the message meant for the user. */
export function unwrapReply<T>(reply: unknown, method: string): T {
  if (typeof reply === 'object' && reply !== null && 'ok' in reply) {
    const candidate = reply as { ok: unknown; value?: unknown; message?: unknown };
    if (candidate.ok === true) return candidate.value as T;
    if (candidate.ok === false && typeof candidate.message === 'string') throw new Error(candidate.message);
  }
  throw new Error(`Whence's window got an unexpected answer to ${method}; restart Whence, and report this if it happens again.`);
}
