/** An error whose message is safe and useful to show the person who caused it (optionally for one field). */
export class UserFacingError extends Error {
  constructor(
    message: string,
    readonly field?: string,
  ) {
    super(message);
  }
}
