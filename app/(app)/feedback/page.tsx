import { hasRole, requirePageUser } from "@/lib/server/guard";
import { EstimatesPage } from "@/components/feedback/estimates-page";

export const metadata = { title: "Utilisation" };

export default async function FeedbackRoute() {
  const user = await requirePageUser(["supervisor", "manager", "purchaser"]);
  return (
    <div className="space-y-4">
      <div>
        <h1>Powder utilisation from actual use</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Deposited ÷ used powder per done run, by line and coating. From three runs on, new estimates and the forecast use the measured figure instead of the nominal one.
        </p>
      </div>
      <EstimatesPage unitSystem={user.unitSystem} canEdit={hasRole(user, ["supervisor"])} />
    </div>
  );
}
