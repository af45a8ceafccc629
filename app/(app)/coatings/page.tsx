import { requirePageUser, hasRole } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { CoatingsTable } from "@/components/coatings/coatings-table";

export const metadata = { title: "Coatings" };

export default async function CoatingsPage() {
  const user = await requirePageUser();
  const plant = await plantSettings();
  return (
    <div className="space-y-4">
      <div>
        <h1>Coatings</h1>
        <p className="mt-1 text-sm text-ink-soft">Powders and e-coat paints: film build, cure schedule, price, supplier and stock by lot.</p>
      </div>
      <CoatingsTable unitSystem={user.unitSystem} currency={plant.currency} canEdit={hasRole(user, ["purchaser"])} />
    </div>
  );
}
