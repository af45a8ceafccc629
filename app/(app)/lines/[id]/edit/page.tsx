import Link from "next/link";
import { recordOrNotFound, requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { getLine } from "@/lib/server/lines";
import { LineEditor } from "@/components/lines/line-editor";

export const metadata = { title: "Edit line" };

export default async function EditLinePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(["manager"]);
  const { id } = await params;
  const line = await recordOrNotFound(id, getLine);
  const plant = await plantSettings();
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/lines/${line.id}`}>← {line.name}</Link>
      </nav>
      <h1>Edit {line.name}</h1>
      <LineEditor key={line.updatedAt} initial={line} unitSystem={user.unitSystem} currency={plant.currency} />
    </div>
  );
}
