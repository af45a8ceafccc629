import Link from "next/link";
import { hasRole, requirePageUser } from "@/lib/server/guard";
import { GAUGE_PAGE_ROLES } from "@/lib/server/film-checks";
import { GaugesScreenLazy } from "@/components/film-checks/gauges-lazy";

export const metadata = { title: "Gauges" };

export default async function GaugesRoute() {
  const user = await requirePageUser(GAUGE_PAGE_ROLES);
  return (
    <div className="space-y-4">
      {hasRole(user, ["supervisor", "manager"]) && (
        <nav aria-label="Breadcrumb" className="text-sm">
          <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/quality">← Quality</Link>
        </nav>
      )}
      <div>
        <h1 className="text-2xl font-semibold">Film-thickness gauges</h1>
        <p className="mt-1 max-w-3xl text-sm text-ink-soft">
          Every gauge film readings are taken with: its ASTM D7091 type (1, magnetic pull-off; 2, electronic), serial number and last
          verification. How often a gauge must be verified is your plant&apos;s choice — its quality procedure or a customer&apos;s
          specification; 12 months is a common interval. Check the gauge on reference standards before use as that procedure says.
        </p>
      </div>
      <GaugesScreenLazy canEdit={hasRole(user, ["operator", "supervisor"])} />
    </div>
  );
}
