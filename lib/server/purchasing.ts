/**
 * Purchase requests: one per supplier e-mail from the forecast's order quantities, sent by e-mail;
 * sent → confirmed → received (or cancelled). Receiving creates stock lots in the same transaction.
 */
import { getDb, type Db } from "@/db/index";
import { findCoatingRow, insertLot, listCoatingRows, type CoatingRow } from "@/db/queries/coatings";
import { addReceived, deleteRequest, findRequestRow, insertRequest, lastReferenceNumber, linesOf, listRequestRows, updateRequest, type RequestLineRow, type RequestRow } from "@/db/queries/purchasing";
import { isUniqueViolation } from "./http";
import type { CreateRequestsInput, ReceiveInput } from "@/lib/validation/purchasing";
import { addMonths, dateToEpoch, epochToDate, nowSeconds } from "./coatings";
import { ApiError } from "./http";
import { sendMail } from "./mail";
import type { SessionUser } from "./session";

export type RequestStatus = RequestRow["status"];

export const REQUEST_TRANSITIONS: Readonly<Record<RequestStatus, readonly RequestStatus[]>> = {
  sent: ["confirmed", "received", "cancelled"],
  confirmed: ["received", "cancelled"],
  received: [],
  cancelled: [],
};

export interface RequestLineView {
  id: number;
  coatingId: number;
  code: string;
  name: string;
  containers: number;
  containerKg: number;
  orderedKg: number;
  receivedKg: number;
  leadTimeDays: number;
  expectedDate: string;
}

export interface RequestView {
  id: number;
  reference: string;
  supplierName: string;
  supplierEmail: string;
  status: RequestStatus;
  sentDate: string;
  confirmedAt: number | null;
  receivedAt: number | null;
  cancelledAt: number | null;
  notes: string;
  nextStatuses: RequestStatus[];
  lines: RequestLineView[];
}

const DAY_S = 86_400;

function view(r: RequestRow, lines: RequestLineRow[], coatings: Map<number, CoatingRow>): RequestView {
  const sentDay = dateToEpoch(epochToDate(r.sent_at));
  return {
    id: r.id,
    reference: r.reference,
    supplierName: r.supplier_name,
    supplierEmail: r.supplier_email,
    status: r.status,
    sentDate: epochToDate(r.sent_at),
    confirmedAt: r.confirmed_at,
    receivedAt: r.received_at,
    cancelledAt: r.cancelled_at,
    notes: r.notes,
    nextStatuses: [...REQUEST_TRANSITIONS[r.status]],
    lines: lines.map((l) => {
      const c = coatings.get(l.coating_id);
      return {
        id: l.id,
        coatingId: l.coating_id,
        code: c?.code ?? "?",
        name: c?.name ?? "",
        containers: l.containers,
        containerKg: l.container_kg,
        orderedKg: l.containers * l.container_kg,
        receivedKg: l.received_kg,
        leadTimeDays: l.lead_time_days,
        // expected arrival = sent date + the supplier's lead time
        expectedDate: epochToDate(sentDay + l.lead_time_days * DAY_S),
      };
    }),
  };
}

async function views(db: Db, rows: RequestRow[]): Promise<RequestView[]> {
  const [lines, coatings] = await Promise.all([linesOf(db, rows.map((r) => r.id)), listCoatingRows(db, { includeArchived: true })]);
  const byId = new Map(coatings.map((c) => [c.id, c]));
  return rows.map((r) =>
    view(
      r,
      lines.filter((l) => l.request_id === r.id),
      byId,
    ),
  );
}

export async function listRequests(): Promise<RequestView[]> {
  const db = await getDb();
  return views(db, await listRequestRows(db));
}

/** Open requests (sent or confirmed), for the forecast's expected arrivals. */
export async function openRequests(db: Db): Promise<RequestView[]> {
  return views(db, await listRequestRows(db, ["sent", "confirmed"]));
}

export async function getRequest(id: number): Promise<RequestView> {
  const db = await getDb();
  const row = await findRequestRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such purchase request.");
  return (await views(db, [row]))[0];
}

/** The e-mail to the supplier: reference, lines as containers × container kg, and who to answer. */
export function requestMail(r: RequestView, plantName: string, buyer: { name: string; email: string }): { subject: string; text: string } {
  const lines = r.lines.map((l) => `  ${l.code}  ${l.name}: ${l.containers} × ${l.containerKg} kg = ${l.orderedKg} kg`);
  return {
    subject: `Purchase request ${r.reference} from ${plantName}`,
    text: [
      `Dear ${r.supplierName},`,
      "",
      `Please supply the following (our reference ${r.reference}):`,
      "",
      ...lines,
      "",
      ...(r.notes ? [r.notes, ""] : []),
      `Please confirm the delivery date, quoting ${r.reference}.`,
      "",
      `${buyer.name} <${buyer.email}>`,
      plantName,
    ].join("\n"),
  };
}

/**
 * One request per supplier e-mail for the chosen coatings, stored and e-mailed in one transaction
 * each: a request whose mail cannot be sent is not kept.
 */
export async function createRequests(input: CreateRequestsInput, user: SessionUser): Promise<RequestView[]> {
  const db = await getDb();
  const coatings = new Map<number, CoatingRow>();
  const fields: Record<string, string> = {};
  for (const [i, l] of input.lines.entries()) {
    const c = await findCoatingRow(db, l.coatingId);
    if (!c) fields[`lines.${i}.coatingId`] = "No such coating.";
    else if (!c.supplier_email.trim()) {
      fields[`lines.${i}.supplierEmail`] = `${c.code} has no supplier contact e-mail; add it in the coatings library first.`;
    } else coatings.set(c.id, c);
  }
  const first = Object.entries(fields)[0];
  if (first) throw new ApiError(400, "invalid_input", `${first[0]}: ${first[1]}`, fields);

  const groups = new Map<string, { coating: CoatingRow; containers: number }[]>();
  for (const l of input.lines) {
    const c = coatings.get(l.coatingId)!;
    const key = c.supplier_email.toLowerCase();
    const g = groups.get(key) ?? [];
    const same = g.find((x) => x.coating.id === c.id);
    if (same) same.containers += l.containers;
    else g.push({ coating: c, containers: l.containers });
    groups.set(key, g);
  }
  const plant = await db.selectFrom("plant_settings").select("plant_name").executeTakeFirst();
  const t = nowSeconds();
  const year = new Date(t * 1000).getUTCFullYear();
  const ids: number[] = [];
  for (const [email, g] of groups) {
    const id = await db.transaction().execute(async (trx) => {
      const n = (await lastReferenceNumber(trx, year)) + 1;
      const reference = `PR-${year}-${String(n).padStart(4, "0")}`;
      return insertRequest(
        trx,
        { reference, supplier_name: g[0].coating.supplier_name, supplier_email: email, status: "sent", sent_at: t, confirmed_at: null, received_at: null, cancelled_at: null, notes: input.notes ?? "", created_by: user.id, created_at: t },
        g.map((x) => ({ coating_id: x.coating.id, containers: x.containers, container_kg: x.coating.container_kg, lead_time_days: x.coating.lead_time_days, received_kg: 0 })),
      );
    });
    // The mail goes out after the commit (the local capture writes to the same database); a
    // request whose mail fails is removed again, so none is kept unsent.
    const v = await getRequest(id);
    const mail = requestMail(v, plant?.plant_name ?? "Coatwright", { name: user.name, email: user.email });
    try {
      await sendMail({ to: email, subject: mail.subject, text: mail.text });
    } catch (e) {
      await deleteRequest(db, id);
      throw new ApiError(502, "server_error", `The e-mail to ${email} could not be sent (${(e as Error).message}); request not kept.`);
    }
    ids.push(id);
  }
  const out: RequestView[] = [];
  for (const id of ids) out.push(await getRequest(id));
  return out;
}

export async function setRequestStatus(id: number, status: "confirmed" | "cancelled"): Promise<RequestView> {
  const db = await getDb();
  const row = await findRequestRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such purchase request.");
  if (!REQUEST_TRANSITIONS[row.status].includes(status)) {
    throw new ApiError(409, "conflict", `A ${row.status} request cannot become ${status}.`, { status: `From ${row.status} it may go to: ${REQUEST_TRANSITIONS[row.status].join(", ") || "nothing"}.` });
  }
  const t = nowSeconds();
  await updateRequest(db, id, status === "confirmed" ? { status, confirmed_at: t } : { status, cancelled_at: t });
  return getRequest(id);
}

/**
 * Receives a request as stock lots, all or nothing. More than ordered on a line needs `confirm`.
 * The expiry defaults to the received date plus the coating's shelf life, as for any lot.
 */
export async function receiveRequest(id: number, input: ReceiveInput): Promise<RequestView> {
  const db = await getDb();
  const request = await getRequest(id);
  if (request.status !== "sent" && request.status !== "confirmed") {
    throw new ApiError(409, "conflict", `Request ${request.reference} is ${request.status}; only a sent or confirmed request can be received.`, { status: "Already closed." });
  }
  const fields: Record<string, string> = {};
  const over: Record<string, string> = {};
  const byLine = new Map<number, number>();
  input.lots.forEach((lot, i) => {
    const line = request.lines.find((l) => l.id === lot.lineId);
    if (!line) fields[`lots.${i}.lineId`] = `Request ${request.reference} has no such line.`;
    if (dateToEpoch(lot.receivedDate) > nowSeconds() + DAY_S) fields[`lots.${i}.receivedDate`] = "A lot cannot be received in the future.";
    byLine.set(lot.lineId, (byLine.get(lot.lineId) ?? 0) + lot.kgReceived);
  });
  const first = Object.entries(fields)[0];
  if (first) throw new ApiError(400, "invalid_input", `${first[0]}: ${first[1]}`, fields);
  for (const [lineId, kg] of byLine) {
    const line = request.lines.find((l) => l.id === lineId)!;
    const i = input.lots.findIndex((l) => l.lineId === lineId);
    if (line.receivedKg + kg > line.orderedKg + 1e-9) {
      over[`lots.${i}.kgReceived`] = `${line.receivedKg + kg} kg of ${line.code} is more than the ${line.orderedKg} kg ordered.`;
    }
  }
  const firstOver = Object.entries(over)[0];
  if (firstOver && input.confirm !== true) {
    throw new ApiError(409, "conflict", `${firstOver[0]}: ${firstOver[1]} Send confirm: true to receive it anyway.`, { ...over, confirm: "Confirm to receive more than ordered." });
  }
  const coatings = new Map((await listCoatingRows(db, { includeArchived: true })).map((c) => [c.id, c]));
  const t = nowSeconds();
  await db.transaction().execute(async (trx) => {
    for (const [i, lot] of input.lots.entries()) {
      const line = request.lines.find((l) => l.id === lot.lineId)!;
      const coating = coatings.get(line.coatingId)!;
      const expiryDate = lot.expiryDate ?? addMonths(lot.receivedDate, coating.shelf_life_months);
      try {
        await insertLot(trx, {
          coating_id: coating.id,
          lot_number: lot.lotNumber,
          received_at: dateToEpoch(lot.receivedDate),
          expires_at: dateToEpoch(expiryDate),
          kg_on_hand: lot.kgReceived,
          created_at: t,
        });
      } catch (e) {
        if (isUniqueViolation(e)) {
          throw new ApiError(409, "conflict", `lots.${i}.lotNumber: lot ${lot.lotNumber} of ${coating.code} is already in stock.`, { [`lots.${i}.lotNumber`]: "This lot number is already recorded for this coating." });
        }
        throw e;
      }
      await addReceived(trx, lot.lineId, lot.kgReceived);
    }
    await updateRequest(trx, id, { status: "received", received_at: t });
  });
  return getRequest(id);
}
