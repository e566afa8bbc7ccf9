/**
 * A bad inversion input (bounds, data, names). The CLI turns it into a
 * non-zero exit, the app into HTTP 400; the message names the problem.
 */
export class InversionInputError extends Error {
  readonly kind = 'inversion-input';
  constructor(message: string) {
    super(message);
    this.name = 'InversionInputError';
  }
}
