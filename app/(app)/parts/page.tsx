import { hasRole, requirePageUser } from "@/lib/server/guard";
import { PartsTable } from "@/components/parts/parts-table";

export const metadata = { title: "Parts" };

export default async function PartsPage() {
  const user = await requirePageUser();
  return (
    <div className="space-y-4">
      <div>
        <h1>Parts</h1>
        <p className="mt-1 max-w-3xl text-sm text-ink-soft">
          Every part the line coats: its coated area (from an STL file, a shape template, a formula or a known figure), masking, mass and
          size for racking.
        </p>
      </div>
      <PartsTable unitSystem={user.unitSystem} canEdit={hasRole(user, ["engineer"])} />
    </div>
  );
}
