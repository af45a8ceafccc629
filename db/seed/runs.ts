import type { Db } from "../index";

/*
 * Bramblecote's plan for today and tomorrow: a few invented runs on its three lines, using the
 * demo parts (db/seed/parts.ts) and coatings (db/seed/coatings-lines.ts). Parts, coatings and
 * lines are looked up by number, code and name; a run whose part (or anything else) is missing
 * is skipped, so the demo still seeds when the catalogue is empty.
 */
const DAY_S = 86_400;

interface SeedCoat {
  code: string;
  filmUm: number;
  fpe?: number;
  reclaim?: number;
}

interface SeedRun {
  day: 0 | 1;
  line: string;
  shift: 1 | 2;
  part: string;
  quantity: number;
  status: "draft" | "planned" | "in-progress";
  lineSpeedMPerMin?: number;
  clearanceMm: number;
  orientations: "any" | "upright";
  coats: SeedCoat[];
  masking?: string;
  notes?: string;
}

const LINE1 = "Line 1 — E-coat and powder";
const LINE2 = "Line 2 — Powder only";
const OVEN = "Batch oven B — gas";
// Line 1's booth has no reclaim; Line 2's booth reclaims most of its overspray.
const primer: SeedCoat = { code: "EC-200", filmUm: 20 };
const line1Powder = (code: string, filmUm = 70): SeedCoat => ({ code, filmUm, fpe: 0.55, reclaim: 0 });
const line2Powder = (code: string, filmUm = 70): SeedCoat => ({ code, filmUm, fpe: 0.5, reclaim: 0.8 });

// Listed in board order; today's Line 1 runs are deliberately not light to dark, and tomorrow's
// Line 1 runs overflow the 8 h shift (the board flags it).
const runs: SeedRun[] = [
  {
    day: 0,
    line: LINE1,
    shift: 1,
    part: "BC-2210",
    quantity: 600,
    status: "in-progress",
    clearanceMm: 50,
    orientations: "any",
    coats: [primer, line1Powder("PP-430")],
    masking: "Silicone caps on the two stud bosses\nHigh-temperature tape over the earth tab",
    notes: "Tollbridge order 4471; first 10 for the customer's salt-spray panels.",
  },
  {
    day: 0,
    line: LINE1,
    shift: 1,
    part: "BC-4105",
    quantity: 120,
    status: "planned",
    clearanceMm: 50,
    orientations: "any",
    coats: [primer, line1Powder("PP-420", 80)],
    notes: "Powder the outside and rim; the inside keeps e-coat only.",
  },
  {
    day: 0,
    line: LINE1,
    shift: 1,
    part: "BC-1043",
    quantity: 2000,
    status: "planned",
    // 6 mm plate needs the slower speed for its e-coat bake
    lineSpeedMPerMin: 2.5,
    clearanceMm: 30,
    orientations: "upright",
    coats: [primer],
    masking: "None: hang through the 14 mm hole",
    notes: "E-coat only; Ashgrove topcoats on site.",
  },
  {
    day: 0,
    line: LINE2,
    shift: 1,
    part: "BC-5020",
    quantity: 300,
    status: "planned",
    clearanceMm: 60,
    orientations: "upright",
    coats: [line2Powder("PZ-610", 60), line2Powder("PP-410", 80)],
    masking: "Plug both vent holes at the feet after pretreatment",
  },
  {
    day: 0,
    line: OVEN,
    shift: 1,
    part: "BC-3300",
    quantity: 48,
    status: "planned",
    clearanceMm: 80,
    orientations: "upright",
    coats: [line2Powder("PP-420", 80)],
    notes: "Sprayed in the Line 2 booth between its runs.",
  },
  {
    day: 1,
    line: LINE1,
    shift: 1,
    part: "BC-2210",
    quantity: 1800,
    status: "planned",
    clearanceMm: 50,
    orientations: "any",
    coats: [primer, line1Powder("PP-410")],
    masking: "Silicone caps on the two stud bosses",
  },
  {
    day: 1,
    line: LINE1,
    shift: 1,
    part: "BC-4105",
    quantity: 250,
    status: "draft",
    clearanceMm: 50,
    orientations: "any",
    coats: [primer, line1Powder("PH-510", 60)],
    notes: "Showroom samples: white hybrid is for indoor display only.",
  },
  {
    day: 1,
    line: LINE2,
    shift: 1,
    part: "BC-1042",
    quantity: 200,
    status: "draft",
    clearanceMm: 40,
    orientations: "any",
    coats: [line2Powder("PP-410", 80)],
    masking: "Plugs in the four M10 foot-plate holes",
  },
];

export async function seedRuns(db: Db, nowS = Math.floor(Date.now() / 1000)): Promise<number> {
  const today = Math.floor(nowS / DAY_S) * DAY_S;
  const [parts, coatings, lines, supervisor] = await Promise.all([
    db.selectFrom("parts").select(["id", "number"]).where("archived", "=", 0).execute(),
    db.selectFrom("coatings").select(["id", "code"]).where("archived_at", "is", null).execute(),
    db.selectFrom("lines").select(["id", "name"]).where("archived_at", "is", null).execute(),
    db.selectFrom("users").select("id").where("role", "=", "supervisor").limit(1).executeTakeFirst(),
  ]);
  const partId = new Map(parts.map((p) => [p.number, p.id]));
  const coatingId = new Map(coatings.map((c) => [c.code, c.id]));
  const lineId = new Map(lines.map((l) => [l.name, l.id]));
  const sequence = new Map<string, number>();
  let made = 0;
  for (const r of runs) {
    const part = partId.get(r.part);
    const line = lineId.get(r.line);
    const coats = r.coats.map((c) => ({ ...c, id: coatingId.get(c.code) }));
    if (!part || !line || coats.some((c) => c.id === undefined)) continue;
    const runDate = today + r.day * DAY_S;
    const board = `${line}/${runDate}/${r.shift}`;
    const seq = sequence.get(board) ?? 0;
    sequence.set(board, seq + 1);
    const { id } = await db
      .insertInto("runs")
      .values({
        part_id: part,
        quantity: r.quantity,
        line_id: line,
        run_date: runDate,
        shift: r.shift,
        sequence: seq,
        line_speed_m_per_min: r.lineSpeedMPerMin ?? null,
        clearance_mm: r.clearanceMm,
        orientations: r.orientations,
        orientation_json: null,
        parts_per_carrier_override: null,
        masking: r.masking ?? "",
        notes: r.notes ?? "",
        status: r.status,
        created_by: supervisor?.id ?? null,
        created_at: nowS,
        updated_at: nowS,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db
      .insertInto("run_coats")
      .values(
        coats.map((c, position) => ({
          run_id: id,
          position,
          coating_id: c.id!,
          film_um: c.filmUm,
          first_pass_efficiency: c.fpe ?? null,
          reclaim_efficiency: c.fpe === undefined ? null : (c.reclaim ?? 0),
        })),
      )
      .execute();
    made += 1;
  }
  return made;
}
