import { NumericalError } from '../../errors.js';

/** Code of the NumericalError a structured solver throws when a numerical check fails (it cannot vouch for its answer). */
export const STRUCTURED_UNAVAILABLE = 'structured-unavailable';
/** Code of the NumericalError a structured solver throws when the problem lacks the structure it needs. */
export const STRUCTURED_NOT_APPLICABLE = 'structured-not-applicable';

export function unavailable(reason: string): never {
  throw new NumericalError(reason, STRUCTURED_UNAVAILABLE);
}

export function notApplicable(reason: string): never {
  throw new NumericalError(reason, STRUCTURED_NOT_APPLICABLE);
}
