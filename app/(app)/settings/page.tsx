import { requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { UnitPreferenceForm } from "./unit-preference-form";
import { PlantSettingsForm } from "./plant-settings-form";

export const metadata = { title: "Settings" };

export default async function SettingsPage() {
  const user = await requirePageUser();
  const plant = await plantSettings();
  return (
    <div className="max-w-2xl space-y-6">
      <h1>Settings</h1>
      <section className="card" aria-labelledby="units-h">
        <h2 id="units-h">Display units</h2>
        <p className="mb-3 text-sm text-ink-soft">
          Coatwright stores and computes in metric; this choice only changes what you see. Forms accept either.
        </p>
        <UnitPreferenceForm current={user.unitSystem} />
      </section>
      {user.role === "admin" ? (
        <section className="card" aria-labelledby="plant-h">
          <h2 id="plant-h">Plant</h2>
          <PlantSettingsForm initial={plant} />
        </section>
      ) : (
        <section className="card text-sm" aria-labelledby="plant-h">
          <h2 id="plant-h">Plant</h2>
          <dl className="mt-2 grid grid-cols-2 gap-1">
            <dt className="text-ink-soft">Name</dt><dd>{plant.plantName}</dd>
            <dt className="text-ink-soft">Currency</dt><dd>{plant.currency}</dd>
            <dt className="text-ink-soft">Shift length</dt><dd className="num">{plant.shiftHours} h</dd>
          </dl>
        </section>
      )}
    </div>
  );
}
