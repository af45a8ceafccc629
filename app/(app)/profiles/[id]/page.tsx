import Link from "next/link";
import { notFound } from "next/navigation";
import { hasRole, requirePageUser } from "@/lib/server/guard";
import { ProfileDetailView } from "@/components/profiles/profile-detail";

export const metadata = { title: "Oven profile" };

export default async function ProfilePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser(["supervisor", "engineer", "manager"]);
  const { id } = await params;
  if (!/^\d{1,12}$/.test(id)) notFound();
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="no-print text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/profiles">← Oven profiles</Link>
      </nav>
      <ProfileDetailView
        id={Number(id)}
        unitSystem={user.unitSystem}
        canApply={hasRole(user, ["supervisor", "engineer", "manager"])}
        canDelete={hasRole(user, ["supervisor", "engineer"])}
      />
    </div>
  );
}
