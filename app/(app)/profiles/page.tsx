import { hasRole, requirePageUser } from "@/lib/server/guard";
import { ProfilesView } from "@/components/profiles/profiles-view";

export const metadata = { title: "Oven profiles" };

export default async function ProfilesPage() {
  const user = await requirePageUser(["supervisor", "engineer", "manager"]);
  return (
    <div className="space-y-4">
      <div>
        <h1>Oven profiles</h1>
        <p className="mt-1 max-w-3xl text-sm text-ink-soft">
          Metal-temperature curves measured by a data logger sent through an oven: each part probe judged against the coating&apos;s cure schedule, and the
          oven&apos;s heat-transfer coefficient fitted from the air and part probes so the cure check uses the plant&apos;s own oven.
        </p>
      </div>
      <ProfilesView unitSystem={user.unitSystem} canImport={hasRole(user, ["supervisor", "engineer"])} />
    </div>
  );
}
