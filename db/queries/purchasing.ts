import type { Insertable, Selectable, Updateable } from "kysely";
import type { Db } from "../index";
import type { PurchaseRequestLinesTable, PurchaseRequestsTable } from "../schema";

export type RequestRow = Selectable<PurchaseRequestsTable>;
export type RequestLineRow = Selectable<PurchaseRequestLinesTable>;

export function listRequestRows(db: Db, statuses?: RequestRow["status"][]): Promise<RequestRow[]> {
  let q = db.selectFrom("purchase_requests").selectAll();
  if (statuses?.length) q = q.where("status", "in", statuses);
  return q.orderBy("id", "desc").execute();
}

export function findRequestRow(db: Db, id: number): Promise<RequestRow | undefined> {
  return db.selectFrom("purchase_requests").selectAll().where("id", "=", id).executeTakeFirst();
}

export function linesOf(db: Db, requestIds: number[]): Promise<RequestLineRow[]> {
  if (!requestIds.length) return Promise.resolve([]);
  return db.selectFrom("purchase_request_lines").selectAll().where("request_id", "in", requestIds).orderBy("id").execute();
}

/** The highest sequence number used in a year's references ("PR-2026-0007" → 7). */
export async function lastReferenceNumber(db: Db, year: number): Promise<number> {
  const rows = await db.selectFrom("purchase_requests").select("reference").where("reference", "like", `PR-${year}-%`).execute();
  return rows.reduce((m, r) => Math.max(m, Number(r.reference.split("-")[2]) || 0), 0);
}

export async function insertRequest(
  db: Db,
  row: Insertable<PurchaseRequestsTable>,
  lines: Omit<Insertable<PurchaseRequestLinesTable>, "request_id">[],
): Promise<number> {
  const r = await db.insertInto("purchase_requests").values(row).returning("id").executeTakeFirstOrThrow();
  await db.insertInto("purchase_request_lines").values(lines.map((l) => ({ ...l, request_id: r.id }))).execute();
  return r.id;
}

export async function updateRequest(db: Db, id: number, patch: Updateable<PurchaseRequestsTable>): Promise<void> {
  await db.updateTable("purchase_requests").set(patch).where("id", "=", id).execute();
}

export async function addReceived(db: Db, lineId: number, kg: number): Promise<void> {
  const line = await db.selectFrom("purchase_request_lines").select("received_kg").where("id", "=", lineId).executeTakeFirstOrThrow();
  await db.updateTable("purchase_request_lines").set({ received_kg: line.received_kg + kg }).where("id", "=", lineId).execute();
}

export async function requestsUsingCoating(db: Db, coatingId: number): Promise<{ kind: string; id: number; label: string }[]> {
  const rows = await db
    .selectFrom("purchase_request_lines")
    .innerJoin("purchase_requests", "purchase_requests.id", "purchase_request_lines.request_id")
    .select(["purchase_requests.id", "purchase_requests.reference"])
    .where("purchase_request_lines.coating_id", "=", coatingId)
    .where("purchase_requests.status", "in", ["sent", "confirmed"])
    .execute();
  return rows.map((r) => ({ kind: "purchase-request", id: r.id, label: r.reference }));
}

export async function deleteRequest(db: Db, id: number): Promise<void> {
  await db.deleteFrom("purchase_requests").where("id", "=", id).execute();
}
