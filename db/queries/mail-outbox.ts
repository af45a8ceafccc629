import type { Db } from "../index";
import type { MailMessage } from "../schema";

export async function insertMail(db: Db, m: Omit<MailMessage, "id">): Promise<void> {
  await db.insertInto("mail_outbox").values(m).execute();
}

export function listMail(db: Db, limit = 200): Promise<MailMessage[]> {
  return db.selectFrom("mail_outbox").selectAll().orderBy("id", "desc").limit(limit).execute();
}
