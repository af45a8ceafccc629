import crypto from "node:crypto";
import { hash } from "@node-rs/argon2";
import type { Db } from "../index";
import type { Role } from "../schema";
import { seedCoatingsAndLines } from "./coatings-lines";
import { seedParts } from "./parts";
import { seedRuns } from "./runs";
import { seedRackPlans } from "./rack-plans";
import { seedScenarios } from "./scenarios";
import { seedProfiles } from "./profiles";
import { seedFilmChecks } from "./film-checks";

/*
 * The demo scenario: Bramblecote Steelworks, an invented fabricator of steel outdoor goods.
 * Every name, number and address here is made up. Later capabilities add their rows below.
 */
export const DEMO_PASSWORD = "coatwright-demo";

const demoUsers: { role: Role; name: string }[] = [
  { role: "admin", name: "Idris Fennimore" },
  { role: "manager", name: "Marguerite Oakhill" },
  { role: "supervisor", name: "Tobias Wrenfield" },
  { role: "engineer", name: "Priya Castellane" },
  { role: "purchaser", name: "Dorothea Pell" },
  { role: "operator", name: "Samir Holloway" },
];

export const demoEmail = (role: Role) => `${role}@bramblecote.test`;

/** Seeds an empty database; does nothing when any user exists. One transaction: all or nothing. */
export async function seedDemo(db: Db): Promise<boolean> {
  const existing = await db.selectFrom("users").select("id").limit(1).executeTakeFirst();
  if (existing) return false;
  const passwordHash = await hash(DEMO_PASSWORD, { memoryCost: 19456, timeCost: 2, parallelism: 1 });
  const t = Math.floor(Date.now() / 1000);
  await db.transaction().execute(async (trx) => {
    await trx
      .insertInto("plant_settings")
      .values({ id: 1, plant_name: "Bramblecote Steelworks", currency: "USD", shift_hours: 8, default_unit_system: "metric", updated_at: t })
      .execute();
    await trx
      .insertInto("users")
      .values(
        demoUsers.map((u) => ({
          id: crypto.randomUUID(),
          email: demoEmail(u.role),
          name: u.name,
          role: u.role,
          password_hash: passwordHash,
          active: 1,
          unit_system: u.role === "purchaser" || u.role === "manager" ? ("us" as const) : ("metric" as const),
          created_at: t,
        })),
      )
      .execute();
    await seedCoatingsAndLines(trx, t);
    await seedParts(trx, t);
    // after parts and lines; runs read saved plans when they are planned, so the order with runs is free
    await seedRackPlans(trx, t);
    await seedRuns(trx, t);
    await seedScenarios(trx, t);
    await seedProfiles(trx, t);
    await seedFilmChecks(trx, t);
  });
  return true;
}
