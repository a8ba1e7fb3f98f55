// Test helper: asserts that a call throws a WhenceError with the given stable code and a message naming each fragment.
import { expect } from 'vitest';
import { WhenceError } from '../../core/errors';

export function expectWhenceError(call: () => unknown, code: string, fragments: readonly string[] = []): void {
  let caught: unknown;
  try {
    call();
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(WhenceError);
  expect((caught as WhenceError).code).toBe(code);
  for (const fragment of fragments) expect((caught as WhenceError).message).toContain(fragment);
}
