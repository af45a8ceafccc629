import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import { getDb } from "@/db/index";
import { insertMail } from "@/db/queries/mail-outbox";

/*
 * The local stand-in for a hosted mail service: a real SMTP server on 127.0.0.1 that stores what
 * it receives in the mail_outbox table, where admins read it. Started only when SMTP_URL is unset.
 */

interface Fake {
  port: number;
  server: SMTPServer;
}
const key = Symbol.for("coatwright.mailFake");
type G = typeof globalThis & { [key]?: Promise<Fake> };

export function startMailFake(): Promise<Fake> {
  const g = globalThis as G;
  g[key] ??= new Promise<Fake>((resolve, reject) => {
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ["STARTTLS", "AUTH"],
      logger: false,
      size: 10 * 1024 * 1024,
      onData(stream, _session, callback) {
        simpleParser(stream)
          .then(async (mail) => {
            const to = [mail.to].flat().filter(Boolean).map((a) => (a as { text: string }).text).join(", ");
            await insertMail(await getDb(), {
              from_address: mail.from?.text ?? "",
              to_addresses: to,
              subject: mail.subject ?? "",
              text_body: mail.text ?? "",
              received_at: Math.floor(Date.now() / 1000),
            });
            callback();
          })
          .catch((e: Error) => callback(e));
      },
    });
    const port = Number(process.env.MAIL_FAKE_PORT ?? 0);
    server.on("error", reject);
    server.listen(port, "127.0.0.1", () => {
      const address = server.server.address();
      resolve({ port: typeof address === "object" && address ? address.port : port, server });
    });
  });
  return g[key]!;
}

export async function stopMailFake(): Promise<void> {
  const g = globalThis as G;
  const f = g[key];
  g[key] = undefined;
  if (f) {
    const { server } = await f;
    await new Promise<void>((r) => server.close(() => r()));
  }
}
