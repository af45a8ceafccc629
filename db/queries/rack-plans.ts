import type { Insertable, Selectable, Updateable } from "kysely";
import type { Db } from "../index";
import type { RackPlansTable } from "../schema";

export type RackPlanRow = Selectable<RackPlansTable>;
export type NewRackPlanRow = Insertable<RackPlansTable>;

/** A saved plan with what lists show beside it: the part, the line and who saved it. */
export type RackPlanListRow = RackPlanRow & {
  part_number: string;
  part_name: string;
  part_length_mm: number;
  part_width_mm: number;
  part_height_mm: number;
  part_mass_kg: number;
  part_archived: number;
  part_updated_at: number;
  line_name: string;
  line_kind: "conveyor" | "batch";
  line_archived_at: number | null;
  line_updated_at: number;
  creator_name: string | null;
  updater_name: string | null;
};

function withNames(db: Db) {
  return db
    .selectFrom("rack_plans")
    .innerJoin("parts", "parts.id", "rack_plans.part_id")
    .innerJoin("lines", "lines.id", "rack_plans.line_id")
    .leftJoin("users as creator", "creator.id", "rack_plans.created_by")
    .leftJoin("users as updater", "updater.id", "rack_plans.updated_by")
    .selectAll("rack_plans")
    .select([
      "parts.number as part_number",
      "parts.name as part_name",
      "parts.length_mm as part_length_mm",
      "parts.width_mm as part_width_mm",
      "parts.height_mm as part_height_mm",
      "parts.mass_kg as part_mass_kg",
      "parts.archived as part_archived",
      "parts.updated_at as part_updated_at",
      "lines.name as line_name",
      "lines.kind as line_kind",
      "lines.archived_at as line_archived_at",
      "lines.updated_at as line_updated_at",
      "creator.name as creator_name",
      "updater.name as updater_name",
    ]);
}

export interface RackPlanFilter {
  partId?: string;
  lineId?: number;
}

export function listRackPlanRows(db: Db, f: RackPlanFilter = {}): Promise<RackPlanListRow[]> {
  let q = withNames(db);
  if (f.partId !== undefined) q = q.where("rack_plans.part_id", "=", f.partId);
  if (f.lineId !== undefined) q = q.where("rack_plans.line_id", "=", f.lineId);
  return q.orderBy("parts.number").orderBy("lines.name").execute();
}

export function findRackPlanRow(db: Db, id: number): Promise<RackPlanListRow | undefined> {
  return withNames(db).where("rack_plans.id", "=", id).executeTakeFirst();
}

export function findRackPlanFor(db: Db, partId: string, lineId: number): Promise<RackPlanRow | undefined> {
  return db.selectFrom("rack_plans").selectAll().where("part_id", "=", partId).where("line_id", "=", lineId).executeTakeFirst();
}

/** The saved plans of any of these parts (runs look theirs up by part × line). */
export function rackPlansForParts(db: Db, partIds: string[]): Promise<RackPlanRow[]> {
  if (!partIds.length) return Promise.resolve([]);
  return db.selectFrom("rack_plans").selectAll().where("part_id", "in", partIds).execute();
}

export async function insertRackPlan(db: Db, row: NewRackPlanRow): Promise<number> {
  const { id } = await db.insertInto("rack_plans").values(row).returning("id").executeTakeFirstOrThrow();
  return id;
}

export async function updateRackPlan(db: Db, id: number, patch: Updateable<RackPlansTable>): Promise<void> {
  await db.updateTable("rack_plans").set(patch).where("id", "=", id).execute();
}

export async function deleteRackPlan(db: Db, id: number): Promise<boolean> {
  const r = await db.deleteFrom("rack_plans").where("id", "=", id).executeTakeFirst();
  return Number(r.numDeletedRows) > 0;
}
