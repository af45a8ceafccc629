/** Why a geometry input was refused. Route handlers map every code to a 400. */
export type GeometryErrorCode =
  | "empty_file"
  | "truncated"
  | "ascii_syntax"
  | "non_finite"
  | "zero_area"
  | "no_triangles"
  | "not_stl"
  | "invalid_dimension"
  | "unknown_template"
  | "formula_syntax"
  | "formula_unknown_name"
  | "formula_not_allowed"
  | "formula_result"
  | "masked_exceeds_area"
  | "invalid_value";

/**
 * A domain error from lib/geometry: `message` is a plain sentence meant for the person who
 * uploaded the file or typed the dimensions; `field` names the input it is about
 * ("file" for meshes, the dimension name for templates).
 */
export class GeometryError extends Error {
  readonly code: GeometryErrorCode;
  readonly field: string;

  constructor(code: GeometryErrorCode, message: string, field = "file") {
    super(message);
    this.name = "GeometryError";
    this.code = code;
    this.field = field;
  }
}
