/** An expected failure with a stable code the renderer can act on (not a bug). */
export class HandlerError extends Error {
  readonly code: string;

  constructor(code: string, message: string) {
    super(message);
    this.name = 'HandlerError';
    this.code = code;
  }
}
