import type { Db } from "../index";

/*
 * One invented oven profile for the demo: a data logger sent through Line 1's powder cure oven
 * with an air probe and two part probes, a thin 1.5 mm bracket (cures) and a thick 8 mm base
 * plate (never reaches the cure temperature). The curves come from the lumped heat-up model
 * (ρ c L_c dT/dt = h (T_air − T), L_c = thickness/2; Çengel, Heat Transfer, ch. 4) in an oven whose
 * true h is 24 W/m²K — lower than the 30 W/m²K the line was set up with — plus a little
 * deterministic noise. The stage keeps its 30 until someone stores the fitted value.
 */
const LOGGER = "Logger 7 (SN 40217)";
const SAMPLE_S = 10;
const DURATION_S = 26 * 60;
const TRUE_H_W_PER_M2K = 24;
const STEEL_RHO_C = 7850 * 490;

/** The air the logger sees: a minute outside, 20 min in the oven (60 m at 3 m/min), then the cool-down tunnel. */
function airC(t: number): number {
  const enter = 60;
  const exit = enter + 20 * 60;
  const inside = (s: number) => 24 + (211 - 24) * (1 - Math.exp(-(s - enter) / 45)) + 1.5 * Math.sin((2 * Math.PI * (s - enter)) / 300);
  if (t < enter) return 24;
  if (t <= exit) return inside(t);
  return 30 + (inside(exit) - 30) * Math.exp(-(t - exit) / 50);
}

/** mulberry32, so the demo is the same on every seeding */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function metalCurve(thicknessMm: number, timeS: number[]): number[] {
  const k = TRUE_H_W_PER_M2K / (STEEL_RHO_C * (thicknessMm / 2000));
  const out: number[] = [];
  let T = 24;
  let t = 0;
  for (const target of timeS) {
    // 0.5 s midpoint steps: far finer than the 2 min+ time constants here
    while (t < target - 1e-9) {
      const dt = Math.min(0.5, target - t);
      const mid = T + (dt / 2) * k * (airC(t) - T);
      T += dt * k * (airC(t + dt / 2) - mid);
      t += dt;
    }
    out.push(T);
  }
  return out;
}

export async function seedProfiles(db: Db, nowS = Math.floor(Date.now() / 1000)): Promise<void> {
  const line = await db.selectFrom("lines").select("id").where("name", "=", "Line 1 — E-coat and powder").executeTakeFirst();
  const coating = await db.selectFrom("coatings").select("id").where("code", "=", "PP-410").executeTakeFirst();
  if (!line || !coating) return;
  const stage = await db
    .selectFrom("line_stages")
    .select(["position", "name"])
    .where("line_id", "=", line.id)
    .where("name", "=", "Powder cure oven")
    .executeTakeFirst();
  if (!stage) return;
  const supervisor = await db.selectFrom("users").select("id").where("role", "=", "supervisor").executeTakeFirst();

  const rnd = random(40217);
  const noise = () => (rnd() * 2 - 1) * 0.3;
  const timeS = Array.from({ length: DURATION_S / SAMPLE_S + 1 }, (_, i) => i * SAMPLE_S);
  const round2 = (v: number) => Math.round(v * 100) / 100;
  const probes = [
    { column: "T2 (°C)", label: "Thin bracket", thicknessMm: 1.5 },
    { column: "T3 (°C)", label: "Thick base plate", thicknessMm: 8 },
  ];
  const series = {
    timeS,
    airC: timeS.map((t) => round2(airC(t) + noise())),
    probes: probes.map((p) => ({ ...p, tempsC: metalCurve(p.thicknessMm, timeS).map((v) => round2(v + noise())) })),
  };
  const mapping = {
    timeColumn: "Elapsed (s)",
    timeFormat: "seconds",
    temperatureUnit: "C",
    airColumn: "T1 Air (°C)",
    probes: probes.map(({ column, label, thicknessMm }) => ({ column, label, thicknessMm })),
  };
  const mappingJson = JSON.stringify(mapping);
  const { id: loggerId } = await db
    .insertInto("loggers")
    .values({ name: LOGGER, mapping_json: mappingJson, created_at: nowS, updated_at: nowS })
    .returning("id")
    .executeTakeFirstOrThrow();
  await db
    .insertInto("oven_profiles")
    .values({
      name: "Line 1 powder oven — bench brackets and base plates",
      line_id: line.id,
      stage_position: stage.position,
      stage_name: stage.name,
      coating_id: coating.id,
      run_id: null,
      logger_id: loggerId,
      file_name: "logger7-line1-powder-oven.csv",
      measured_on: new Date((nowS - 2 * 86_400) * 1000).toISOString().slice(0, 10),
      notes: "Logger ran on carrier 14 at the usual 3 m/min. Invented demo data.",
      overbake_margin_k: 20,
      sample_count: timeS.length,
      duration_s: DURATION_S,
      probe_count: probes.length,
      mapping_json: mappingJson,
      series_json: JSON.stringify(series),
      created_by: supervisor?.id ?? null,
      created_at: nowS - 2 * 86_400,
    })
    .execute();
}
