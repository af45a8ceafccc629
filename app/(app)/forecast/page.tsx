import { hasRole, requirePageUser } from "@/lib/server/guard";
import { ForecastPage } from "@/components/forecast/forecast-page";

export const metadata = { title: "Forecast" };

export default async function ForecastRoute() {
  const user = await requirePageUser(["purchaser", "manager"]);
  return (
    <div className="space-y-4">
      <div>
        <h1>Material forecast</h1>
        <p className="mt-1 text-sm text-ink-soft">Powder and e-coat paint the planned runs need, against stock by lot and open purchase requests.</p>
      </div>
      <ForecastPage unitSystem={user.unitSystem} canOrder={hasRole(user, ["purchaser"])} />
    </div>
  );
}
