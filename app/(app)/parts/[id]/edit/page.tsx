import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageUser } from "@/lib/server/guard";
import { ApiError } from "@/lib/server/http";
import { DENSITY_KG_PER_M3 } from "@/lib/geometry/mass";
import { meshMaxBytes } from "@/lib/server/meshes";
import { getPart, templateCatalogue } from "@/lib/server/parts";
import { PartFormLazy } from "@/components/parts/part-form-lazy";

export const metadata = { title: "Edit part" };

export default async function EditPartPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(["engineer"]);
  const { id } = await params;
  const found = await getPart(id).catch((e) => {
    if (e instanceof ApiError && e.status === 404) notFound();
    throw e;
  });
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/parts/${found.part.id}`}>← {found.part.number}</Link>
      </nav>
      <h1>Edit {found.part.number}</h1>
      <PartFormLazy
        key={found.part.updatedAt}
        unitSystem={user.unitSystem}
        maxBytes={meshMaxBytes()}
        templates={templateCatalogue()}
        densities={{ ...DENSITY_KG_PER_M3 }}
        initial={found}
      />
    </div>
  );
}
