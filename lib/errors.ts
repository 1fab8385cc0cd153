/** An error whose message is safe and useful to show the person who caused it (optionally for one field). */
export class UserFacingError extends Error {
  constructor(
    message: string,
    readonly field?: string,
  ) {
    super(message);
  }
}

/**
 * Input refused as invalid after the schema passed (a rule that needs the database or the
 * stored file): answered like a schema failure, 400 with the field named.
 */
export class InvalidFieldError extends UserFacingError {
  constructor(
    message: string,
    readonly field: string,
  ) {
    super(message, field);
  }
}
