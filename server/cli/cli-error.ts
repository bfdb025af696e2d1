/** An input problem the user can fix: reported as one stderr line, exit code 2. */
export class CliInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CliInputError';
  }
}
