import Link from "next/link";
import { requirePageUser } from "@/lib/server/guard";
import { DENSITY_KG_PER_M3 } from "@/lib/geometry/mass";
import { meshMaxBytes } from "@/lib/server/meshes";
import { templateCatalogue } from "@/lib/server/parts";
import { PartFormLazy } from "@/components/parts/part-form-lazy";

export const metadata = { title: "Create part" };

export default async function NewPartPage() {
  const user = await requirePageUser(["engineer"]);
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/parts">← Parts</Link>
      </nav>
      <h1>Create part</h1>
      <PartFormLazy unitSystem={user.unitSystem} maxBytes={meshMaxBytes()} templates={templateCatalogue()} densities={{ ...DENSITY_KG_PER_M3 }} />
    </div>
  );
}
