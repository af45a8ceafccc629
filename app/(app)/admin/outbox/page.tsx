import { requirePageUser } from "@/lib/server/guard";
import { getDb } from "@/db/index";
import { listMail } from "@/db/queries/mail-outbox";

export const metadata = { title: "Mail outbox" };

export default async function OutboxPage() {
  await requirePageUser(["admin"]);
  const mails = await listMail(await getDb());
  const captured = !process.env.SMTP_URL;
  return (
    <div className="space-y-4">
      <h1>Mail outbox</h1>
      <p className="text-sm text-ink-soft">
        {captured
          ? "No SMTP_URL is set, so outgoing e-mail goes to Coatwright's local capture server and stops here: nothing leaves this machine."
          : "Outgoing e-mail goes to the SMTP server in SMTP_URL; messages captured earlier are listed below."}
      </p>
      {mails.length === 0 ? (
        <p className="card text-sm">No messages yet. Invitations, password resets and purchase requests appear here.</p>
      ) : (
        <ul className="space-y-3">
          {mails.map((m) => (
            <li key={m.id} className="card">
              <details>
                <summary className="cursor-pointer">
                  <span className="font-medium">{m.subject}</span>
                  <span className="ml-2 text-sm text-ink-soft">to {m.to_addresses} · {new Date(m.received_at * 1000).toLocaleString("en-GB")}</span>
                </summary>
                <pre className="mt-3 whitespace-pre-wrap text-sm">{m.text_body}</pre>
              </details>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
