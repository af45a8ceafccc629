import Link from "next/link";
import { hasRole, requirePageUser } from "@/lib/server/guard";
import { RequestsPage } from "@/components/purchasing/requests-page";

export const metadata = { title: "Purchasing" };

export default async function PurchaseRequestsRoute() {
  const user = await requirePageUser(["purchaser", "manager"]);
  return (
    <div className="space-y-4">
      <div>
        <h1>Purchase requests</h1>
        <p className="mt-1 text-sm text-ink-soft">
          Requests e-mailed to suppliers. New ones are made from the <Link className="underline" href="/forecast">forecast</Link>.
        </p>
      </div>
      <RequestsPage unitSystem={user.unitSystem} canEdit={hasRole(user, ["purchaser"])} />
    </div>
  );
}
