import Link from "next/link";
import { requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { LineEditor } from "@/components/lines/line-editor";

export const metadata = { title: "New line" };

export default async function NewLinePage() {
  const user = await requirePageUser(["manager"]);
  const plant = await plantSettings();
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/lines">← Lines</Link>
      </nav>
      <h1>New line</h1>
      <LineEditor unitSystem={user.unitSystem} currency={plant.currency} />
    </div>
  );
}
