import Link from "next/link";
import { requirePageUser } from "@/lib/server/guard";
import { QualityTrend } from "@/components/film-checks/quality-trend";

export const metadata = { title: "Quality" };

export default async function QualityRoute({ searchParams }: { searchParams: Promise<{ coatingId?: string; lineId?: string }> }) {
  const user = await requirePageUser(["supervisor", "manager"]);
  const sp = await searchParams;
  const num = (s?: string) => (s && /^\d{1,12}$/.test(s) ? Number(s) : null);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-semibold">Quality — film build over time</h1>
      <p className="text-ink-soft">Each point is one film check of the chosen coating on the chosen line, in run-date order.</p>
      <p className="text-sm">
        <Link className="text-phosphate-dark underline" href="/quality/gauges">Gauges and their verification</Link>
      </p>
      <QualityTrend unitSystem={user.unitSystem} initialCoatingId={num(sp.coatingId)} initialLineId={num(sp.lineId)} />
    </div>
  );
}
