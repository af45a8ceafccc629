import type { Db } from "../index";
import type { PlantSettings } from "../schema";

export function getPlantSettings(db: Db): Promise<PlantSettings | undefined> {
  return db.selectFrom("plant_settings").selectAll().where("id", "=", 1).executeTakeFirst();
}

export async function savePlantSettings(db: Db, s: Omit<PlantSettings, "id">): Promise<void> {
  await db
    .insertInto("plant_settings")
    .values({ id: 1, ...s })
    .onConflict((oc) => oc.column("id").doUpdateSet(s))
    .execute();
}
