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
