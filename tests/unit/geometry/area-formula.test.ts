import { describe, expect, it } from "vitest";
import { evaluateAreaFormula } from "@/lib/geometry/area-formula";
import { GeometryError } from "@/lib/geometry/errors";

const BOX = { L: 400, W: 300, H: 200 };

describe("evaluateAreaFormula (mm in, m² out)", () => {
  it.each([
    // hand working: 2 (400·300 + 400·200 + 300·200) = 2 (120,000 + 80,000 + 60,000) = 520,000 mm²
    { formula: "2*(L*W + L*H + W*H)", dims: BOX, areaM2: 0.52 },
    // open box outside without rim: 400·300 + 2·(400 + 300)·200 = 400,000 mm²
    { formula: "L*W + 2*(L+W)*H", dims: BOX, areaM2: 0.4 },
    // implicit multiplication as people write it: 2LW = 240,000 mm²
    { formula: "2 L W", dims: BOX, areaM2: 0.24 },
    // pipe outside π·60·2000 = 120,000π mm²
    { formula: "pi*D*L", dims: { D: 60, L: 2000 }, areaM2: 0.12 * Math.PI },
    // a disc of diameter 200: π/4 · 200² = 10,000π mm²
    { formula: "pi/4 * D^2", dims: { D: 200 }, areaM2: 0.01 * Math.PI },
    // a right triangle plate 300 x 400, both faces: 2 · ½ · 300 · 400 = 120,000 mm²; hypotenuse 500
    { formula: "A*B + (A + B + hypot(A, B))*T", dims: { A: 300, B: 400, T: 0 }, areaM2: 0.12 },
    { formula: "sqrt(A)^2", dims: { A: 1e6 }, areaM2: 1 },
  ])("$formula", ({ formula, dims, areaM2 }) => {
    expect(evaluateAreaFormula(formula, dims as Record<string, number>)).toBeCloseTo(areaM2, 12);
  });
});

function error(formula: string, dims: Record<string, number> = BOX): GeometryError {
  try {
    evaluateAreaFormula(formula, dims);
  } catch (e) {
    expect(e).toBeInstanceOf(GeometryError);
    return e as GeometryError;
  }
  throw new Error("expected an error");
}

describe("plain-word errors", () => {
  it("names the unknown dimension and lists the available ones", () => {
    const e = error("2*(L*W + Q)");
    expect(e.code).toBe("formula_unknown_name");
    expect(e.field).toBe("formula");
    expect(e.message).toBe('Unknown name "Q" in the formula — available: L, W, H.');
  });

  it.each([
    // mathjs numbers characters from 1: the ")" of "2*L W)" is the 6th
    ["2*L W)", 6],
    ["2*(L+", 6],
    ["L+*W", 3],
  ])("syntax error in %s at character %i", (formula, char) => {
    const e = error(formula);
    expect(e.code).toBe("formula_syntax");
    expect(e.message).toContain(`at character ${char}`);
    expect(e.message).toMatch(/^The formula has a syntax error/);
  });

  it.each([["   "], [""]])("empty formula %j", (formula) => {
    expect(error(formula).code).toBe("formula_syntax");
  });

  it.each([
    ["W - L", /does not give a positive area \(it gives -100\)/],
    ["0*L", /positive area/],
    ["L/0", /positive area/],
    ["sqrt(-L)", /not a number/],
  ])("result %s is refused", (formula, message) => {
    const e = error(formula);
    expect(e.code).toBe("formula_result");
    expect(e.message).toMatch(message);
  });

  it.each([
    ["L = 5"],
    ["f(x) = x^2"],
    ['"text"'],
    ["[L, W]"],
    ["L > W"],
    ["L ? W : H"],
    ["evaluate(\"1+1\")"],
    ["import({})"],
    ["L; W"],
    ["L!"],
  ])("%s is not allowed", (formula) => {
    const e = error(formula);
    expect(["formula_not_allowed", "formula_syntax"]).toContain(e.code);
  });

  it("units written in the formula are unknown names, not conversions", () => {
    expect(error("L * 5 cm").code).toBe("formula_unknown_name");
  });

  it("refuses a non-finite dimension", () => {
    const e = error("L*W", { L: Number.POSITIVE_INFINITY, W: 2 });
    expect(e.code).toBe("invalid_dimension");
    expect(e.field).toBe("L");
  });
});
