/** A value a person entered that no computation can accept; `field` names the input. */
export class DomainValidationError extends Error {
  constructor(
    public readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'DomainValidationError';
  }
}
