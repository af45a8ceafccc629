import Link from "next/link";
import { requirePageUser } from "@/lib/server/guard";
import { CSV_COLUMNS } from "@/lib/server/parts";
import { PartsImport } from "@/components/parts/parts-import";

export const metadata = { title: "Import parts" };

export default async function ImportPartsPage() {
  const user = await requirePageUser(["engineer"]);
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/parts">← Parts</Link>
      </nav>
      <div>
        <h1>Import parts from CSV</h1>
        <p className="mt-1 max-w-3xl text-sm text-ink-soft">
          Every row is checked before anything is saved. The file is imported whole, or, if you choose so, only its valid rows; either way
          in one step.
        </p>
      </div>
      <PartsImport unitSystem={user.unitSystem} columns={CSV_COLUMNS.filter((c) => c !== "coatedAreaM2")} />
    </div>
  );
}
