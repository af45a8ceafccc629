/**
 * The OpenAPI 3.1 description of the calculation routes, generated from the same zod schemas the
 * handlers validate with (lib/validation/calc.ts), so the document cannot drift from the code.
 */
import { z } from "zod";
import {
  cureInputSchema,
  cureResultSchema,
  ecoatInputSchema,
  ecoatResultSchema,
  filmInputSchema,
  filmResultSchema,
  lineInputSchema,
  lineResultSchema,
  powderInputSchema,
  powderResultSchema,
} from "@/lib/validation/calc";

type JsonSchema = Record<string, unknown>;

interface CalcRoute {
  path: string;
  name: string;
  summary: string;
  description: string;
  input: z.ZodType;
  output: z.ZodType;
}

export const calcRoutes: readonly CalcRoute[] = [
  {
    path: "/api/calc/powder",
    name: "Powder",
    summary: "Powder use, coverage and material utilisation",
    description:
      "Theoretical coverage m²/kg = 1000 / (SG × filmUm) (Products Finishing, \"Coverage of Powder\", metric form); " +
      "utilisation with reclaim FPE / (1 − r(1 − FPE)) (derived).",
    input: powderInputSchema,
    output: powderResultSchema,
  },
  {
    path: "/api/calc/ecoat",
    name: "Ecoat",
    summary: "Electrocoat deposited solids, charge and rectifier current",
    description: "Deposited solids ρ × DFT × area; charge = mass / coulombic yield; current = charge per part × parts/h / 3600 s.",
    input: ecoatInputSchema,
    output: ecoatResultSchema,
  },
  {
    path: "/api/calc/line",
    name: "Line",
    summary: "Conveyor throughput and oven dwell",
    description: "Carriers/h = line speed × 60 / carrier pitch; oven dwell = oven path / line speed.",
    input: lineInputSchema,
    output: lineResultSchema,
  },
  {
    path: "/api/calc/cure",
    name: "Cure",
    summary: "Metal heat-up and cure time in a convection oven",
    description:
      "Lumped heat-up t = ρ c (thicknessMm/2) / h × ln((Tair − T0)/(Tair − Ttarget)) (Çengel, Heat Transfer, ch. 4); " +
      "a warning when the Biot number is 0.1 or more. A target at or above the air temperature is a 400.",
    input: cureInputSchema,
    output: cureResultSchema,
  },
  {
    path: "/api/calc/film",
    name: "Film",
    summary: "Dry film thickness acceptance (SSPC-PA 2 or ISO 19840)",
    description:
      "SSPC-PA 2 default restriction level: area means within spec, no spot below 80 % of the minimum or above 120 % " +
      "of the maximum. ISO 19840: mean ≥ nominal, readings ≥ 80 % of nominal, at most 20 % between 80 % and 100 %, " +
      "none above the maximum.",
    input: filmInputSchema,
    output: filmResultSchema,
  },
];

/** Units and meaning of every input field; the names carry the unit, these say what to measure. */
const inputDescriptions: Record<string, string> = {
  areaM2: "coated area of one part, m²",
  filmUm: "dry film thickness, µm",
  specificGravity: "specific gravity of the powder against water (ASTM D5965)",
  firstPassEfficiency: "first-pass transfer efficiency by weight, more than 0 and at most 1",
  reclaimEfficiency: "share of the overspray reclaimed and resprayed, 0 to 1",
  parts: "number of parts",
  pricePerKg: "powder price per kg, in the plant's currency",
  filmDensityGPerCm3: "cured film density, g/cm³ (about 1.3–1.5; from memory)",
  coulombicYieldMgPerC: "film mass deposited per coulomb, mg/C (about 30 for cathodic epoxy; from memory)",
  partsPerHour: "parts coated per hour",
  lineSpeedMPerMin: "conveyor speed, m/min",
  carrierPitchM: "centre-to-centre distance of carriers, m",
  partsPerCarrier: "parts hung on one carrier",
  ovenPathLengthM: "conveyor path length inside the cure oven, m",
  requiredDwellMin: "time the parts need in the oven (heat-up + hold), min",
  loadedFraction: "share of carriers that carry parts; scales parts/h, not carriers/h",
  thicknessMm: "equivalent thickness 2·V/A: a plate's thickness, half a round bar's diameter, mm",
  airTempC: "oven air temperature, °C",
  startTempC: "metal temperature entering the oven, °C",
  targetMetalTempC: "metal temperature the cure schedule asks for, °C; below airTempC",
  holdMin: "time at the target metal temperature, min",
  heatTransferCoefficientWPerM2K: "convection coefficient, W/(m²·K); real cure ovens about 20–60 (from memory)",
  densityKgPerM3: "metal density, kg/m³ (steel 7850)",
  specificHeatJPerKgK: "metal specific heat, J/(kg·K) (steel about 490 near 200 °C)",
  thermalConductivityWPerMK: "metal thermal conductivity, W/(m·K) (steel about 45–60)",
  ovenDwellMin: "oven dwell available, min; gives dwellMarginMin",
  rule: "acceptance rule",
  specMinUm: "specified minimum dry film thickness, µm",
  specMaxUm: "specified maximum dry film thickness, µm",
  areas: "SSPC-PA 2: areas, each a list of spots, each a list of gauge readings in µm",
  nominalUm: "ISO 19840 nominal dry film thickness, µm",
  readingsUm: "ISO 19840 gauge readings, µm",
};

function describeInputs(schema: JsonSchema): JsonSchema {
  const props = schema.properties as Record<string, JsonSchema> | undefined;
  if (props) {
    for (const [key, prop] of Object.entries(props)) {
      if (inputDescriptions[key] && !prop.description) prop.description = inputDescriptions[key];
    }
  }
  for (const option of (schema.oneOf ?? schema.anyOf ?? []) as JsonSchema[]) describeInputs(option);
  return schema;
}

function jsonSchema(schema: z.ZodType, io: "input" | "output"): JsonSchema {
  // OpenAPI 3.1 schema objects are JSON Schema 2020-12; the dialect is declared once at the top.
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { target: "draft-2020-12", io }) as JsonSchema;
  return rest;
}

const errorCodes = ["invalid_input", "unauthenticated", "forbidden", "not_found", "conflict", "too_large", "rate_limited"] as const;

export const errorBodySchema = z.object({
  error: z.object({
    code: z.enum(errorCodes),
    message: z.string().describe("what went wrong, naming the field and what to enter"),
    fields: z
      .record(z.string(), z.string())
      .describe("dot path of each bad input (e.g. part.massKg, areas.0.2) → what to enter")
      .optional(),
  }),
});

const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const errorResponse = (description: string) => ({ description, content: { "application/json": { schema: ref("Error") } } });

function buildDocument() {
  const schemas: Record<string, JsonSchema> = { Error: jsonSchema(errorBodySchema, "output") };
  const paths: Record<string, unknown> = {};
  for (const r of calcRoutes) {
    schemas[`${r.name}Input`] = describeInputs(jsonSchema(r.input, "input"));
    schemas[`${r.name}Result`] = jsonSchema(r.output, "output");
    paths[r.path] = {
      post: {
        operationId: `calc${r.name}`,
        tags: ["Calculators"],
        summary: r.summary,
        description: r.description,
        requestBody: { required: true, content: { "application/json": { schema: ref(`${r.name}Input`) } } },
        responses: {
          "200": { description: "The result, metric, the unit in every name.", content: { "application/json": { schema: ref(`${r.name}Result`) } } },
          "400": errorResponse("Malformed JSON, a missing, unknown or out-of-range field, or a result that is not a finite number; `fields` names each."),
          "401": errorResponse("No session: sign in first."),
          "403": errorResponse("The request came from another site."),
          "413": errorResponse("The body is larger than 1 MB."),
        },
      },
    };
  }
  paths["/api/openapi.json"] = {
    get: {
      operationId: "openApiDocument",
      tags: ["Meta"],
      summary: "This document",
      responses: {
        "200": { description: "OpenAPI 3.1 document", content: { "application/json": { schema: { type: "object" } } } },
        "401": errorResponse("No session: sign in first."),
      },
    },
  };
  return {
    openapi: "3.1.0",
    jsonSchemaDialect: "https://spec.openapis.org/oas/3.1/dialect/base",
    info: {
      title: "Coatwright calculation API",
      version: "1.0.0",
      description:
        "Calculators of the finishing department. JSON in and out; metric values with the unit in every field name " +
        "(areaM2, filmUm). Every error has the shape { error: { code, message, fields? } }.",
    },
    tags: [{ name: "Calculators" }, { name: "Meta" }],
    security: [{ session: [] }],
    paths,
    components: {
      schemas,
      securitySchemes: {
        session: { type: "apiKey", in: "cookie", name: "coatwright_session", description: "Set by POST /api/auth/sign-in." },
      },
    },
  };
}

let cached: ReturnType<typeof buildDocument> | null = null;

/** Built once per process: the schemas are static. */
export function openApiDocument() {
  cached ??= buildDocument();
  return cached;
}
