import { requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { Calculators } from "@/components/calculators/calculators";

export const metadata = { title: "Calculators" };

export default async function CalculatorsPage() {
  const user = await requirePageUser();
  const plant = await plantSettings();
  return (
    <div className="space-y-4">
      <div>
        <h1>Calculators</h1>
        <p className="mt-1 max-w-3xl text-sm text-ink-soft">
          Quick answers for the finishing line. Results follow your typing; every figure names its formula and where it is
          published. Values can be typed in metric or US units — switch below and what you typed is converted.
        </p>
      </div>
      <Calculators initialSystem={user.unitSystem} currency={plant.currency} />
      <p className="text-xs text-ink-faint">
        The same calculations answer <code>POST /api/calc/powder</code>, <code>/ecoat</code>, <code>/line</code>,{" "}
        <code>/cure</code> and <code>/film</code> in metric JSON; they are described in{" "}
        <a className="text-phosphate underline" href="/api/openapi.json">the OpenAPI document</a>.
      </p>
    </div>
  );
}
