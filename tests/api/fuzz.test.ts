import path from "node:path";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { z } from "zod";
import { apiAccess, type Method } from "@/lib/server/access";
import {
  cureResultSchema,
  ecoatResultSchema,
  filmResultSchema,
  lineResultSchema,
  powderResultSchema,
} from "@/lib/validation/calc";
import { request, resetDatabase, signInAs, teardown, useTempDatabase } from "./helpers";

/*
 * Hostile JSON bodies against every write route: wrong types, huge numbers, deep nesting, long
 * strings, SQL and HTML fragments. Never a 5xx; every error has the one error shape; every 2xx
 * of a calculator parses with its output schema (JSON turns NaN into null, which the schema refuses).
 */
const root = path.resolve(__dirname, "../..");
useTempDatabase();
let admin = "";
beforeAll(async () => {
  await resetDatabase();
  admin = await signInAs("admin");
}, 60_000);
afterAll(teardown);

const nasty = fc.oneof(
  fc.constantFrom(
    "'; DROP TABLE users; --",
    "<script>alert(1)</script>",
    "\u0000",
    "1e999",
    "NaN",
    "__proto__",
    "x".repeat(20_000),
    "../../etc/passwd",
  ),
  fc.string({ maxLength: 40 }),
  fc.constantFrom(1e308, -1e308, 5e-324, 0, -0, -1, 2 ** 53 + 1, 1e21),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
);
const deepJson = (depth: number): string => "{\"a\":[".repeat(depth) + "1" + "]}".repeat(depth);
const value: fc.Arbitrary<unknown> = fc.letrec((tie) => ({
  v: fc.oneof({ depthSize: "small", withCrossShrink: true }, nasty, fc.array(tie("v"), { maxLength: 4 }), fc.dictionary(fc.string({ maxLength: 12 }), tie("v"), { maxKeys: 5 })),
})).v;

const writeRows = Object.entries(apiAccess).flatMap(([p, methods]) =>
  (Object.keys(methods) as Method[]).filter((m) => m !== "GET").map((m) => ({ p, m })),
);
// Sign-in routes are fuzzed without the admin's cookie, so sign-out cannot end the session under test.
const cookieFor = (p: string) => (p.startsWith("/api/auth/") ? null : admin);
const modFor = (p: string) => path.join(root, "app", p, "route.ts");
const params = (p: string) => ({ params: Promise.resolve(Object.fromEntries([...p.matchAll(/\[(\w+)\]/g)].map((x) => [x[1], "fuzz-id"]))) });

async function expectSane(res: Response): Promise<unknown> {
  expect(res.status).toBeLessThan(500);
  const text = await res.text();
  const body = text ? JSON.parse(text) : null;
  if (res.status >= 400) {
    expect(typeof body.error.code).toBe("string");
    expect(typeof body.error.message).toBe("string");
    expect(text).not.toMatch(/\n\s+at |SQLITE_|\.tsx?:\d+/);
  }
  return body;
}

describe("every write route survives hostile JSON", () => {
  it.each(writeRows.map((r) => [`${r.m} ${r.p}`, r]))("%s", async (_n, r) => {
    const mod = (await import(modFor(r.p))) as Record<string, (req: Request, ctx: unknown) => Promise<Response>>;
    await fc.assert(
      fc.asyncProperty(fc.oneof(value, fc.dictionary(fc.string({ maxLength: 12 }), value)), async (body) => {
        const res = await mod[r.m](request(r.p.replace(/\[(\w+)\]/g, "fuzz-id"), { method: r.m, body, cookie: cookieFor(r.p) }), params(r.p));
        await expectSane(res);
      }),
      { numRuns: 40, seed: 7 },
    );
    // Deep nesting and a body that is not JSON at all.
    for (const raw of [deepJson(5000), "{\"a\":", "\u0000\u0001", "[]"]) {
      const res = await mod[r.m](request(r.p.replace(/\[(\w+)\]/g, "fuzz-id"), { method: r.m, raw, cookie: cookieFor(r.p), headers: { "content-type": "application/json" } }), params(r.p));
      await expectSane(res);
    }
  });
});

const calcRoutes: [string, z.ZodType, Record<string, unknown>][] = [
  ["/api/calc/powder", powderResultSchema, { areaM2: 1.2, filmUm: 70, specificGravity: 1.5, firstPassEfficiency: 0.6, reclaimEfficiency: 0.9, parts: 10, pricePerKg: 9 }],
  ["/api/calc/ecoat", ecoatResultSchema, { areaM2: 1.2, filmUm: 20, filmDensityGPerCm3: 1.4, coulombicYieldMgPerC: 30, parts: 10, partsPerHour: 200 }],
  ["/api/calc/line", lineResultSchema, { lineSpeedMPerMin: 3, carrierPitchM: 0.6, partsPerCarrier: 4, ovenPathLengthM: 60, requiredDwellMin: 15, loadedFraction: 0.9 }],
  ["/api/calc/cure", cureResultSchema, { thicknessMm: 3, airTempC: 210, startTempC: 20, targetMetalTempC: 190, holdMin: 10, heatTransferCoefficientWPerM2K: 30 }],
  ["/api/calc/film", filmResultSchema, { rule: "iso19840", specMinUm: 60, specMaxUm: 120, nominalUm: 70, readingsUm: [72, 80, 69, 90] }],
];

describe("calculators: mutated valid bodies give a 400 or a 2xx that parses with the output schema", () => {
  it.each(calcRoutes)("%s", async (p, schema, valid) => {
    const mod = (await import(modFor(p))) as { POST: (req: Request) => Promise<Response> };
    const keys = Object.keys(valid);
    await fc.assert(
      fc.asyncProperty(fc.array(fc.tuple(fc.constantFrom(...keys), fc.oneof(nasty, fc.double({ min: -1e6, max: 1e6 }))), { maxLength: 3 }), async (changes) => {
        const body = { ...valid, ...Object.fromEntries(changes) };
        const res = await mod.POST(request(p, { method: "POST", body, cookie: admin }));
        const out = await expectSane(res);
        if (res.status === 200) expect(schema.safeParse(out).success, JSON.stringify(out)).toBe(true);
        else expect(res.status).toBe(400);
      }),
      { numRuns: 150, seed: 11 },
    );
  });
});
