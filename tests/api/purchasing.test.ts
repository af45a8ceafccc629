import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { params, request, resetDatabase, signInAs, teardown, useTempDatabase } from "./helpers";
import { GET as listGet, POST as createPost } from "@/app/api/purchase-requests/route";
import { PATCH as onePatch } from "@/app/api/purchase-requests/[id]/route";
import { POST as receivePost } from "@/app/api/purchase-requests/[id]/receive/route";
import { GET as forecastGet } from "@/app/api/forecast/route";
import type { RequestView } from "@/lib/server/purchasing";
import type { ForecastView } from "@/lib/server/forecast";

useTempDatabase();
let purchaser = "";
beforeAll(async () => {
  await resetDatabase();
});
beforeEach(async () => {
  await resetDatabase();
  purchaser = await signInAs("purchaser");
}, 60_000);
afterAll(teardown);

async function coatingId(code: string): Promise<number> {
  const db = await getDb();
  return (await db.selectFrom("coatings").select("id").where("code", "=", code).executeTakeFirstOrThrow()).id;
}

async function create(body: unknown) {
  return createPost(request("/api/purchase-requests", { method: "POST", body, cookie: purchaser }));
}

describe("purchase requests", () => {
  it("sends one request per supplier, and the SMTP fake receives the lines and the reference", async () => {
    const [pp410, pp420, ec200] = await Promise.all([coatingId("PP-410"), coatingId("PP-420"), coatingId("EC-200")]);
    const res = await create({ lines: [{ coatingId: pp410, containers: 3 }, { coatingId: pp420, containers: 2 }, { coatingId: ec200, containers: 1 }] });
    expect(res.status).toBe(201);
    const { requests } = (await res.json()) as { requests: RequestView[] };
    const db = await getDb();
    const coats = await db.selectFrom("coatings").select(["id", "code", "name", "supplier_email", "container_kg"]).execute();
    const emails = new Set(coats.filter((c) => [pp410, pp420, ec200].includes(c.id)).map((c) => c.supplier_email));
    expect(requests).toHaveLength(emails.size);
    const year = new Date().getUTCFullYear();
    expect(requests.map((r) => r.reference).sort()).toEqual([...requests.keys()].map((i) => `PR-${year}-${String(i + 1).padStart(4, "0")}`));
    for (const r of requests) {
      expect(r.status).toBe("sent");
      const mail = await db.selectFrom("mail_outbox").selectAll().where("to_addresses", "like", `%${r.supplierEmail}%`).orderBy("id", "desc").executeTakeFirstOrThrow();
      expect(mail.subject).toContain(r.reference);
      expect(mail.text_body).toContain(r.reference);
      for (const l of r.lines) {
        const c = coats.find((x) => x.id === l.coatingId)!;
        expect(mail.text_body).toContain(`${c.code}  ${c.name}: ${l.containers} × ${c.container_kg} kg`);
      }
    }
    const pp410Line = requests.flatMap((r) => r.lines).find((l) => l.coatingId === pp410)!;
    expect(pp410Line.containers).toBe(3);
    const rows = await db.selectFrom("purchase_request_lines").selectAll().execute();
    expect(rows).toHaveLength(3);
  });

  it("refuses a coating whose supplier has no contact address, naming the field, and saves nothing", async () => {
    const db = await getDb();
    const id = await coatingId("PP-410");
    await db.updateTable("coatings").set({ supplier_email: "" }).where("id", "=", id).execute();
    const res = await create({ lines: [{ coatingId: await coatingId("PP-420"), containers: 1 }, { coatingId: id, containers: 1 }] });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.fields["lines.1.supplierEmail"]).toMatch(/no supplier contact e-mail/);
    expect(await db.selectFrom("purchase_requests").selectAll().execute()).toHaveLength(0);
  });

  it("confirms, then receives as lots; more than ordered needs confirm; the forecast's stock rises", async () => {
    const id = await coatingId("PP-420");
    const before = ((await (await forecastGet(request("/api/forecast?horizonDays=28", { cookie: purchaser }))).json()).forecast as ForecastView).coatings.find((c) => c.coatingId === id)!;
    const [r] = ((await (await create({ lines: [{ coatingId: id, containers: 2 }] })).json()) as { requests: RequestView[] }).requests;
    const withOpen = ((await (await forecastGet(request("/api/forecast?horizonDays=366", { cookie: purchaser }))).json()).forecast as ForecastView).coatings.find((c) => c.coatingId === id)!;
    expect(withOpen.incomingKg).toBeCloseTo(2 * r.lines[0].containerKg, 9);

    const confirmed = await onePatch(request(`/api/purchase-requests/${r.id}`, { method: "PATCH", body: { status: "confirmed" }, cookie: purchaser }), params({ id: String(r.id) }));
    expect((await confirmed.json()).request.status).toBe("confirmed");

    const today = new Date().toISOString().slice(0, 10);
    const ordered = r.lines[0].orderedKg;
    const lot = { lineId: r.lines[0].id, lotNumber: "NEW-LOT-1", kgReceived: ordered + 5, receivedDate: today };
    const over = await receivePost(request(`/api/purchase-requests/${r.id}/receive`, { method: "POST", body: { lots: [lot] }, cookie: purchaser }), params({ id: String(r.id) }));
    expect(over.status).toBe(409);
    const overBody = await over.json();
    expect(overBody.error.fields.confirm).toBeTruthy();
    expect(overBody.error.fields["lots.0.kgReceived"]).toMatch(/more than the/);
    const db = await getDb();
    expect(await db.selectFrom("coating_lots").selectAll().where("lot_number", "=", "NEW-LOT-1").execute()).toHaveLength(0);

    const ok = await receivePost(request(`/api/purchase-requests/${r.id}/receive`, { method: "POST", body: { lots: [{ ...lot, kgReceived: ordered }] }, cookie: purchaser }), params({ id: String(r.id) }));
    expect(ok.status).toBe(201);
    expect((await ok.json()).request.status).toBe("received");
    const lots = await db.selectFrom("coating_lots").selectAll().where("lot_number", "=", "NEW-LOT-1").execute();
    expect(lots).toHaveLength(1);
    expect(lots[0].kg_on_hand).toBe(ordered);
    expect(lots[0].expires_at).toBeGreaterThan(lots[0].received_at);

    const after = ((await (await forecastGet(request("/api/forecast?horizonDays=28", { cookie: purchaser }))).json()).forecast as ForecastView).coatings.find((c) => c.coatingId === id)!;
    expect(after.stockKg).toBeCloseTo(before.stockKg + ordered, 9);

    const again = await onePatch(request(`/api/purchase-requests/${r.id}`, { method: "PATCH", body: { status: "cancelled" }, cookie: purchaser }), params({ id: String(r.id) }));
    expect(again.status).toBe(409);
  });

  it("lists requests for the purchaser", async () => {
    await create({ lines: [{ coatingId: await coatingId("PP-410"), containers: 1 }] });
    const res = await listGet(request("/api/purchase-requests", { cookie: purchaser }));
    expect((await res.json()).requests).toHaveLength(1);
  });
});
