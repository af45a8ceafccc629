/*
 * Creates the first admin on a database without demo data:
 *   npm run create-admin -- --email ops@example.com [--name "Full Name"]
 * The password is prompted (not echoed), or read from COATWRIGHT_ADMIN_PASSWORD for scripts.
 */
import crypto from "node:crypto";
import readline from "node:readline";
import { getDb, closeDatabase, databasePath } from "../db/index";
import { findUserByEmail, insertUser } from "../db/queries/users";
import { hashPassword } from "../lib/server/password";
import { inviteSchema, newPasswordSchema } from "../lib/validation/auth";

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

function prompt(question: string): Promise<string> {
  return new Promise((resolve) => {
    const rl = readline.createInterface({ input: process.stdin, output: process.stdout, terminal: true });
    const rlWithOutput = rl as unknown as { _writeToOutput: (s: string) => void; output: NodeJS.WriteStream };
    rlWithOutput._writeToOutput = (s: string) => {
      if (s.includes(question)) rlWithOutput.output.write(s);
    };
    rl.question(question, (answer) => {
      rl.close();
      process.stdout.write("\n");
      resolve(answer);
    });
  });
}

async function main() {
  const parsed = inviteSchema.safeParse({ email: arg("email") ?? "", name: arg("name") ?? "Administrator", role: "admin" });
  if (!parsed.success) {
    console.error(`--email: ${parsed.error.issues[0].message}`);
    process.exit(2);
  }
  const password = process.env.COATWRIGHT_ADMIN_PASSWORD ?? (await prompt("Password for the new admin: "));
  const pw = newPasswordSchema.safeParse(password);
  if (!pw.success) {
    console.error(`password: ${pw.error.issues[0].message}`);
    process.exit(2);
  }
  const db = await getDb();
  if (await findUserByEmail(db, parsed.data.email)) {
    console.error(`A user with ${parsed.data.email} already exists.`);
    process.exit(1);
  }
  await insertUser(db, {
    id: crypto.randomUUID(),
    email: parsed.data.email,
    name: parsed.data.name,
    role: "admin",
    password_hash: await hashPassword(pw.data),
    active: 1,
    unit_system: "metric",
    created_at: Math.floor(Date.now() / 1000),
  });
  console.log(`Admin ${parsed.data.email} created in ${databasePath()}.`);
  closeDatabase();
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
