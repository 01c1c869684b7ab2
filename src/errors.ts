/**
 * Typed errors shared by every layer. Each carries a code a caller can switch on and a message a
 * user can act on. The CLI maps InputError (and its subclasses) to exit code 2.
 */
export class LumenfoldError extends Error {
  constructor(
    message: string,
    readonly code: string,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

/** Bad input from a user: a file, an option or an argument that cannot be used as given. */
export class InputError extends LumenfoldError {
  constructor(message: string, code = 'bad-input') {
    super(message, code);
  }
}

/** A physical model that has no answer for this input (for example an excitation that never leaves). */
export class ModelError extends LumenfoldError {
  constructor(message: string, code = 'model') {
    super(message, code);
  }
}

/** A numerical routine that could not produce a trustworthy result (singular or ill-conditioned system). */
export class NumericalError extends LumenfoldError {
  constructor(message: string, code = 'numerical') {
    super(message, code);
  }
}

/** A run stopped on request (Ctrl-C or SIGTERM) after writing a checkpoint; the CLI exits 130. */
export class InterruptedError extends LumenfoldError {
  constructor(message: string) {
    super(message, 'interrupted');
  }
}
