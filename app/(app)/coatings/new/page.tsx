import Link from "next/link";
import { requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { NewCoating } from "@/components/coatings/new-coating";

export const metadata = { title: "New coating" };

export default async function NewCoatingPage() {
  const user = await requirePageUser(["purchaser"]);
  const plant = await plantSettings();
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/coatings">← Coatings</Link>
      </nav>
      <h1>New coating</h1>
      <section className="card">
        <NewCoating unitSystem={user.unitSystem} currency={plant.currency} />
      </section>
    </div>
  );
}
