import Link from "next/link";
import { notFound } from "next/navigation";
import { hasRole, requirePageUser } from "@/lib/server/guard";
import { FilmChecksLazy } from "@/components/film-checks/film-checks-lazy";
import { GAUGE_PAGE_ROLES } from "@/lib/server/film-checks";

export const metadata = { title: "Film checks" };

export default async function FilmChecksRoute({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser();
  const { id } = await params;
  if (!/^\d{1,12}$/.test(id)) notFound();
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/runs/${id}`}>← Run</Link>
      </nav>
      <FilmChecksLazy
        runId={Number(id)}
        unitSystem={user.unitSystem}
        canWrite={hasRole(user, ["operator", "supervisor"])}
        isAdmin={user.role === "admin"}
        canSeeGauges={hasRole(user, GAUGE_PAGE_ROLES)}
      />
    </div>
  );
}
