import { requirePageUser } from "@/lib/server/guard";
import { UsersAdmin } from "./users-admin";

export const metadata = { title: "Users" };

export default async function UsersPage() {
  const me = await requirePageUser(["admin"]);
  return (
    <div className="space-y-6">
      <h1>Users</h1>
      <UsersAdmin meId={me.id} />
    </div>
  );
}
