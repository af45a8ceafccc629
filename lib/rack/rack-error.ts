/** Impossible racking input; `field` is the dot path of the offending value (`part.lengthMm`). */
export class RackInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = "RackInputError";
    this.field = field;
  }
}
