// The typed error for a scene description that cannot be rendered: code 'scene-invalid', the field at fault
// (e.g. 'sources[2].levelDb') and a message saying what the field must be.
import { WhenceError } from '../errors';

export class SceneSpecError extends WhenceError {
  /** Path of the offending field, e.g. 'microphones[1].channel'. */
  readonly field: string;

  constructor(field: string, message: string) {
    super('scene-invalid', `Scene field ${field} ${message}`);
    this.name = 'SceneSpecError';
    this.field = field;
  }
}
