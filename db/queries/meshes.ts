import type { Insertable, Selectable, Updateable } from "kysely";
import type { Db } from "../index";
import type { MeshesTable } from "../schema";

export type MeshRow = Selectable<MeshesTable>;
export type NewMeshRow = Insertable<MeshesTable>;

export async function insertMesh(db: Db, row: NewMeshRow): Promise<void> {
  await db.insertInto("meshes").values(row).execute();
}

export function findMeshRow(db: Db, id: string): Promise<MeshRow | undefined> {
  return db.selectFrom("meshes").selectAll().where("id", "=", id).executeTakeFirst();
}

export async function updateMesh(db: Db, id: string, patch: Updateable<MeshesTable>): Promise<void> {
  await db.updateTable("meshes").set(patch).where("id", "=", id).execute();
}

/** Part numbers that use the mesh (archived parts too). */
export async function partNumbersUsingMesh(db: Db, meshId: string): Promise<string[]> {
  const rows = await db.selectFrom("parts").select("number").where("mesh_id", "=", meshId).orderBy("number").execute();
  return rows.map((r) => r.number);
}

/** Stored file names of every mesh row. */
export async function storedMeshNames(db: Db): Promise<Set<string>> {
  const rows = await db.selectFrom("meshes").select("stored_name").execute();
  return new Set(rows.map((r) => r.stored_name));
}

/**
 * Deletes mesh rows that no part (archived parts included) has used and that were created
 * before `createdBefore`; returns their stored file names so the caller can delete the files.
 */
export async function deleteUnattachedMeshes(db: Db, createdBefore: number): Promise<string[]> {
  return db.transaction().execute(async (trx) => {
    const rows = await trx
      .selectFrom("meshes")
      .select(["id", "stored_name"])
      .where("created_at", "<", createdBefore)
      .where(({ not, exists, selectFrom }) =>
        not(exists(selectFrom("parts").select("parts.id").whereRef("parts.mesh_id", "=", "meshes.id"))),
      )
      .execute();
    if (rows.length > 0) await trx.deleteFrom("meshes").where("id", "in", rows.map((r) => r.id)).execute();
    return rows.map((r) => r.stored_name);
  });
}
