/** A problem handed to the optimiser is malformed (bounds, sizes, start point). */
export class OptimInputError extends Error {
  readonly kind = 'optim-input';
  constructor(message: string) {
    super(message);
    this.name = 'OptimInputError';
  }
}
