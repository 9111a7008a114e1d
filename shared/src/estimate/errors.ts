/**
 * A configuration that is well formed but does not match the price book it is priced against
 * (an unknown surface, a case that does not fit). `field` is the path the player has to fix (for
 * programs); the message is the words a person reads.
 */
export class EstimateInputError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'EstimateInputError';
  }
}
