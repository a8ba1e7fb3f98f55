// The `code` of the WhenceError a call throws (undefined when it returns); any other error is rethrown.
import { WhenceError } from '../../../core/errors';

export function errorCode(call: () => unknown): string | undefined {
  try {
    call();
  } catch (error) {
    if (error instanceof WhenceError) return error.code;
    throw error;
  }
  return undefined;
}
