/** An input a domain computation cannot use; `field` names the offending input. */
export class DomainValidationError extends Error {
  field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'DomainValidationError';
    this.field = field;
  }
}
