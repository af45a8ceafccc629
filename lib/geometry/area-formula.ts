/**
 * Coated area from a formula over named dimensions, e.g. "2*(L*W + L*H + W*H)".
 * Dimensions are in mm, so the formula gives mm²; the result is returned in m².
 * Only arithmetic is allowed: numbers, the dimension names, pi, + - * / ^, parentheses and a
 * few functions. Anything else (assignment, function definitions, matrices, units, strings) is
 * refused before evaluation.
 */
import { parse, type MathNode } from "mathjs";
import { GeometryError } from "./errors";
import { M2_PER_MM2 } from "./length-units";

const FIELD = "formula";
const ALLOWED_FUNCTIONS = new Set(["sqrt", "abs", "min", "max", "hypot", "sin", "cos", "tan"]);
const ALLOWED_OPERATORS = new Set(["add", "subtract", "multiply", "divide", "pow", "unaryMinus", "unaryPlus"]);
const CONSTANTS: Record<string, number> = { pi: Math.PI };

interface MathSyntaxError extends Error {
  char?: number;
}

function describe(node: MathNode): string {
  try {
    return node.toString();
  } catch {
    return node.type;
  }
}

/** Evaluates an area formula (mm²) over `dimensionsMm` and returns the area in m². */
export function evaluateAreaFormula(formula: string, dimensionsMm: Record<string, number>): number {
  if (typeof formula !== "string" || formula.trim() === "") {
    throw new GeometryError("formula_syntax", "The formula is empty.", FIELD);
  }
  for (const [name, value] of Object.entries(dimensionsMm)) {
    if (typeof value !== "number" || !Number.isFinite(value)) {
      throw new GeometryError("invalid_dimension", `The dimension "${name}" must be a finite number of millimetres.`, name);
    }
  }

  let root: MathNode;
  try {
    root = parse(formula);
  } catch (error) {
    const e = error as MathSyntaxError;
    const reason = e.message.replace(/\s*\(char \d+\)\s*$/, "");
    // mathjs counts characters from 1.
    const at = typeof e.char === "number" ? ` at character ${e.char}` : "";
    throw new GeometryError("formula_syntax", `The formula has a syntax error${at}: ${reason}.`, FIELD);
  }

  const available = Object.keys(dimensionsMm);
  root.traverse((node, _path, parent) => {
    switch (node.type) {
      case "ConstantNode":
        if (typeof (node as unknown as { value: unknown }).value !== "number") {
          throw new GeometryError("formula_not_allowed", `The formula may only contain numbers, not ${describe(node)}.`, FIELD);
        }
        return;
      case "ParenthesisNode":
        return;
      case "OperatorNode": {
        const fn = (node as unknown as { fn: string }).fn;
        if (!ALLOWED_OPERATORS.has(fn)) {
          throw new GeometryError(
            "formula_not_allowed",
            `The operator "${(node as unknown as { op: string }).op}" is not allowed; use + - * / ^ and parentheses.`,
            FIELD,
          );
        }
        return;
      }
      case "FunctionNode": {
        const fn = (node as unknown as { fn: MathNode }).fn;
        const name = fn.type === "SymbolNode" ? (fn as unknown as { name: string }).name : "";
        if (!ALLOWED_FUNCTIONS.has(name)) {
          throw new GeometryError(
            "formula_not_allowed",
            `The function "${name || describe(fn)}" is not allowed; available: ${[...ALLOWED_FUNCTIONS].join(", ")}.`,
            FIELD,
          );
        }
        return;
      }
      case "SymbolNode": {
        // A function's own name is checked with its FunctionNode.
        if (parent && parent.type === "FunctionNode" && (parent as unknown as { fn: MathNode }).fn === node) return;
        const name = (node as unknown as { name: string }).name;
        if (Object.prototype.hasOwnProperty.call(dimensionsMm, name) || name in CONSTANTS) return;
        throw new GeometryError(
          "formula_unknown_name",
          `Unknown name "${name}" in the formula — available: ${available.length ? available.join(", ") : "none"}.`,
          FIELD,
        );
      }
      default:
        throw new GeometryError("formula_not_allowed", `"${describe(node)}" is not allowed in an area formula.`, FIELD);
    }
  });

  let value: unknown;
  try {
    value = root.compile().evaluate({ ...CONSTANTS, ...dimensionsMm });
  } catch (error) {
    throw new GeometryError("formula_syntax", `The formula could not be worked out: ${(error as Error).message}.`, FIELD);
  }
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new GeometryError(
      "formula_result",
      `The formula does not give a positive area (it gives ${typeof value === "number" ? String(value) : "a value that is not a number"}).`,
      FIELD,
    );
  }
  return value * M2_PER_MM2;
}
