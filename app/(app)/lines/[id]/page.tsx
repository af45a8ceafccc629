import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageUser, hasRole } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { LineDetail } from "@/components/lines/line-detail";

export const metadata = { title: "Line" };

export default async function LinePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser();
  const { id } = await params;
  if (!/^\d{1,12}$/.test(id)) notFound();
  const plant = await plantSettings();
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/lines">← Lines</Link>
      </nav>
      <LineDetail id={Number(id)} unitSystem={user.unitSystem} currency={plant.currency} canEdit={hasRole(user, ["manager"])} />
    </div>
  );
}
