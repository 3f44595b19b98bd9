import { expect } from 'vitest';
import { DomainValidationError } from '../../../shared/domain/errors';

/** Run `fn`, expect a DomainValidationError, and return it for checks on its field and message. */
export function validationErrorOf(fn: () => unknown): DomainValidationError {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(DomainValidationError);
    return error as DomainValidationError;
  }
  throw new Error('expected a DomainValidationError');
}
