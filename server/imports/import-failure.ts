/**
 * An import that cannot go on, with a stable id and a message a person understands.
 * It crosses the worker boundary as plain data ({ id, message }), never as a thrown object.
 */
export class ImportFailure extends Error {
  constructor(
    public readonly id: string,
    message: string,
  ) {
    super(message);
    this.name = 'ImportFailure';
  }
}

export interface FailureData {
  id: string;
  message: string;
}
