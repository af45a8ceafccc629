import { getDb } from "@/db/index";
import { listMail } from "@/db/queries/mail-outbox";
import { route } from "@/lib/server/http";

export const GET = route("/api/admin/outbox", "GET", async () => {
  const rows = await listMail(await getDb());
  return Response.json({
    messages: rows.map((m) => ({
      id: m.id,
      from: m.from_address,
      to: m.to_addresses,
      subject: m.subject,
      text: m.text_body,
      receivedAt: m.received_at,
    })),
  });
});
