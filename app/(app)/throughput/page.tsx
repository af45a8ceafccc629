import { requirePageUser, hasRole } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { REFERENCE_PART, unitTable } from "@/lib/server/throughput";
import { ThroughputScreenLazy } from "@/components/throughput/throughput-screen-lazy";

export const metadata = { title: "Throughput" };

// Managers compare and save scenarios; supervisors may compare and read them.
export default async function ThroughputPage() {
  const user = await requirePageUser(["manager", "supervisor"]);
  const plant = await plantSettings();
  return (
    <div className="space-y-4">
      <div>
        <h1>Throughput</h1>
        <p className="mt-1 max-w-3xl text-sm text-ink-soft">
          Lines and what-if scenarios side by side for one part and powder: carriers, parts and square metres per hour, oven dwell and cure margin,
          powder and cost per part, and what limits each line.
        </p>
      </div>
      <ThroughputScreenLazy units={unitTable(user.unitSystem)} currency={plant.currency} canEdit={hasRole(user, ["manager"])} referencePart={{ ...REFERENCE_PART }} />
    </div>
  );
}
