import type { Db } from "../index";
import type { Insertable } from "kysely";
import type { LineStagesTable, LinesTable } from "../schema";

/*
 * Bramblecote's coatings library and finishing lines. Every name, supplier, lot number, price and
 * figure here is invented. Lot dates are set relative to the seeding day so the demo always
 * shows a healthy stock, a low-stock powder, a lot near expiry and an expired one.
 */
const DAY_S = 86_400;

function dayStart(s: number): number {
  return Math.floor(s / DAY_S) * DAY_S;
}

function plusMonths(s: number, months: number): number {
  const d = new Date(s * 1000);
  const target = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + months, 1));
  const last = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d.getUTCDate(), last));
  return target.getTime() / 1000;
}

interface SeedCoating {
  code: string;
  name: string;
  kind: "powder" | "e-coat";
  chemistry: string;
  colour: [string, string];
  sg?: number;
  ecoat?: { volumeSolids: number; weightSolids: number; filmDensity: number };
  filmUm: [number, number];
  cure: [number, number][];
  pricePerKg: number;
  container: ["box" | "drum", number];
  supplier: [string, string];
  leadTimeDays: number;
  shelfLifeMonths: number;
  reorderPointKg: number;
  /** [lot number, received this many days ago, kg on hand] */
  lots: [string, number, number][];
}

const ferncastle: [string, string] = ["Ferncastle Powder Works", "ferncastle.sales@supplier.test"];
const ouseburn: [string, string] = ["Ouseburn Finishes", "ouseburn.trade@supplier.test"];
// Process Heating, "Ensuring Adequate Curing of Paint and Powder Coatings": a polyester powder schedule
const polyesterCure: [number, number][] = [[190, 12], [200, 10], [210, 8]];

const coatings: SeedCoating[] = [
  {
    code: "EC-200",
    name: "Cathodic epoxy e-coat primer",
    kind: "e-coat",
    chemistry: "cathodic-epoxy",
    colour: ["Forge Black", "#23262a"],
    ecoat: { volumeSolids: 0.4, weightSolids: 0.5, filmDensity: 1.4 },
    filmUm: [18, 25],
    cure: [[180, 20], [190, 15], [205, 10]],
    pricePerKg: 7.2,
    container: ["drum", 200],
    supplier: ["Larkmoor Coatings Supply", "larkmoor.orders@supplier.test"],
    leadTimeDays: 21,
    shelfLifeMonths: 6,
    reorderPointKg: 400,
    lots: [["LM-26-0411", 40, 520], ["LM-26-0467", 10, 800]],
  },
  {
    code: "PP-410",
    name: "Outdoor polyester, gloss",
    kind: "powder",
    chemistry: "polyester",
    colour: ["Bramble Green", "#3f6b47"],
    sg: 1.55,
    filmUm: [60, 90],
    cure: polyesterCure,
    pricePerKg: 9.4,
    container: ["box", 25],
    supplier: ferncastle,
    leadTimeDays: 10,
    shelfLifeMonths: 12,
    reorderPointKg: 150,
    lots: [["FPW-7731", 60, 175], ["FPW-7802", 15, 250]],
  },
  {
    code: "PP-420",
    name: "Outdoor polyester, satin",
    kind: "powder",
    chemistry: "polyester",
    colour: ["Quarry Grey", "#7a7f80"],
    sg: 1.5,
    filmUm: [60, 90],
    cure: polyesterCure,
    pricePerKg: 9.1,
    container: ["box", 25],
    supplier: ferncastle,
    leadTimeDays: 10,
    shelfLifeMonths: 12,
    reorderPointKg: 120,
    lots: [["FPW-7655", 95, 40]],
  },
  {
    code: "PP-430",
    name: "Outdoor polyester, gloss",
    kind: "powder",
    chemistry: "polyester",
    colour: ["Rosehip Red", "#9e2f2a"],
    sg: 1.48,
    filmUm: [60, 90],
    cure: polyesterCure,
    pricePerKg: 10.6,
    container: ["box", 20],
    supplier: ferncastle,
    leadTimeDays: 14,
    shelfLifeMonths: 12,
    reorderPointKg: 75,
    lots: [["FPW-7120", 330, 60], ["FPW-7790", 20, 100]],
  },
  {
    code: "PH-510",
    name: "Indoor hybrid, matt",
    kind: "powder",
    chemistry: "hybrid",
    colour: ["Chalk White", "#f1efe8"],
    sg: 1.4,
    filmUm: [50, 80],
    cure: [[180, 15], [190, 12], [200, 8]],
    pricePerKg: 8.3,
    container: ["box", 25],
    supplier: ouseburn,
    leadTimeDays: 14,
    shelfLifeMonths: 12,
    reorderPointKg: 100,
    lots: [["OF-23-118", 30, 220]],
  },
  {
    code: "PZ-610",
    name: "Zinc-rich epoxy primer",
    kind: "powder",
    chemistry: "zinc-rich-epoxy",
    colour: ["Zinc Primer Grey", "#8d9092"],
    sg: 2.6,
    filmUm: [50, 75],
    cure: [[180, 15], [200, 10]],
    pricePerKg: 14.8,
    container: ["box", 20],
    supplier: ouseburn,
    leadTimeDays: 28,
    shelfLifeMonths: 9,
    reorderPointKg: 60,
    lots: [["OF-22-907", 300, 15], ["OF-23-140", 25, 80]],
  },
];

type Stage = Omit<LineStagesTable, "id" | "line_id" | "position">;
const stage = (name: string, kind: Stage["kind"], length_m: number, extra: Partial<Stage> = {}): Stage => ({
  name,
  kind,
  length_m,
  temp_c: null,
  heat_transfer_coefficient_w_per_m2k: null,
  colour_change_min: null,
  ...extra,
});

export async function seedCoatingsAndLines(db: Db, nowS = Math.floor(Date.now() / 1000)): Promise<void> {
  const today = dayStart(nowS);
  for (const c of coatings) {
    const { id } = await db
      .insertInto("coatings")
      .values({
        code: c.code,
        name: c.name,
        kind: c.kind,
        chemistry: c.chemistry,
        colour_name: c.colour[0],
        swatch_hex: c.colour[1],
        specific_gravity: c.sg ?? null,
        volume_solids_fraction: c.ecoat?.volumeSolids ?? null,
        weight_solids_fraction: c.ecoat?.weightSolids ?? null,
        film_density_g_per_cm3: c.ecoat?.filmDensity ?? null,
        film_min_um: c.filmUm[0],
        film_max_um: c.filmUm[1],
        price_per_kg: c.pricePerKg,
        container_kind: c.container[0],
        container_kg: c.container[1],
        supplier_name: c.supplier[0],
        supplier_email: c.supplier[1],
        lead_time_days: c.leadTimeDays,
        shelf_life_months: c.shelfLifeMonths,
        reorder_point_kg: c.reorderPointKg,
        archived_at: null,
        created_at: nowS,
        updated_at: nowS,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db
      .insertInto("coating_cure_points")
      .values(c.cure.map(([metal_temp_c, hold_min]) => ({ coating_id: id, metal_temp_c, hold_min })))
      .execute();
    await db
      .insertInto("coating_lots")
      .values(
        c.lots.map(([lot_number, daysAgo, kg_on_hand]) => {
          const received = today - daysAgo * DAY_S;
          return { coating_id: id, lot_number, received_at: received, expires_at: plusMonths(received, c.shelfLifeMonths), kg_on_hand, created_at: nowS };
        }),
      )
      .execute();
  }

  const lineBase = {
    notes: "",
    line_speed_min_m_per_min: null,
    line_speed_max_m_per_min: null,
    line_speed_nominal_m_per_min: null,
    carrier_pitch_m: null,
    interior_width_mm: null,
    interior_height_mm: null,
    interior_depth_mm: null,
    racks_per_load: null,
    air_temp_c: null,
    heat_transfer_coefficient_w_per_m2k: null,
    load_min: null,
    unload_min: null,
    archived_at: null,
    created_at: nowS,
    updated_at: nowS,
  };
  const conveyors: { row: Omit<Insertable<LinesTable>, "kind">; stages: Stage[] }[] = [
    {
      row: {
        ...lineBase,
        name: "Line 1 — E-coat and powder",
        notes: "Seven-stage spray and dip pretreatment, cathodic e-coat with its own bake oven, then one powder booth and the powder cure oven.",
        hourly_cost: 410,
        window_width_mm: 500,
        window_height_mm: 1500,
        window_depth_mm: 600,
        max_load_kg: 45,
        line_speed_min_m_per_min: 1.5,
        line_speed_max_m_per_min: 4.5,
        line_speed_nominal_m_per_min: 3,
        carrier_pitch_m: 0.6,
      },
      stages: [
        stage("Alkaline clean", "clean", 9, { temp_c: 60 }),
        stage("Rinse 1", "rinse", 3),
        stage("Rinse 2", "rinse", 3),
        stage("Conditioner", "rinse", 2),
        stage("Zinc phosphate", "conversion", 6, { temp_c: 50 }),
        stage("Rinse 3", "rinse", 3),
        stage("DI rinse", "rinse", 3),
        stage("E-coat tank", "e-coat", 12, { temp_c: 32 }),
        stage("Permeate rinse", "rinse", 4),
        stage("Final DI rinse", "rinse", 3),
        stage("E-coat bake oven", "cure-oven", 75, { temp_c: 215, heat_transfer_coefficient_w_per_m2k: 35 }),
        stage("Cool-down 1", "cool", 15),
        stage("Powder booth", "powder-booth", 6, { colour_change_min: 20 }),
        stage("Powder cure oven", "cure-oven", 60, { temp_c: 210, heat_transfer_coefficient_w_per_m2k: 30 }),
        stage("Cool-down 2", "cool", 20),
      ],
    },
    {
      row: {
        ...lineBase,
        name: "Line 2 — Powder only",
        notes: "Three-stage iron phosphate washer, dry-off oven, one powder booth with reclaim, cure oven.",
        hourly_cost: 260,
        window_width_mm: 800,
        window_height_mm: 1800,
        window_depth_mm: 700,
        max_load_kg: 80,
        line_speed_min_m_per_min: 1.2,
        line_speed_max_m_per_min: 3.6,
        line_speed_nominal_m_per_min: 2.4,
        carrier_pitch_m: 0.9,
      },
      stages: [
        stage("Cleaner-coater", "conversion", 7, { temp_c: 55 }),
        stage("Rinse", "rinse", 3),
        stage("Sealer rinse", "rinse", 3),
        stage("Dry-off oven", "dry-off", 10, { temp_c: 150, heat_transfer_coefficient_w_per_m2k: 25 }),
        stage("Cool-down 1", "cool", 6),
        stage("Powder booth A", "powder-booth", 5, { colour_change_min: 15 }),
        stage("Cure oven", "cure-oven", 54, { temp_c: 205, heat_transfer_coefficient_w_per_m2k: 28 }),
        stage("Cool-down 2", "cool", 18),
      ],
    },
  ];
  for (const l of conveyors) {
    const { id } = await db.insertInto("lines").values({ ...l.row, kind: "conveyor" }).returning("id").executeTakeFirstOrThrow();
    await db
      .insertInto("line_stages")
      .values(l.stages.map((s, position) => ({ ...s, line_id: id, position })))
      .execute();
  }
  await db
    .insertInto("lines")
    .values({
      ...lineBase,
      name: "Batch oven B — gas",
      kind: "batch",
      notes: "Gas-fired walk-in oven for overflow and heavy sections; parts are sprayed in the Line 2 booth off-line.",
      hourly_cost: 65,
      window_width_mm: 1000,
      window_height_mm: 2000,
      window_depth_mm: 2800,
      max_load_kg: 250,
      interior_width_mm: 2400,
      interior_height_mm: 2400,
      interior_depth_mm: 6000,
      racks_per_load: 4,
      air_temp_c: 200,
      heat_transfer_coefficient_w_per_m2k: 22,
      load_min: 12,
      unload_min: 10,
    })
    .execute();
}
