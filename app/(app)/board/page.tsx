import { hasRole, requirePageUser } from "@/lib/server/guard";
import { DayBoard } from "@/components/board/day-board";

export const metadata = { title: "Day board" };

export default async function BoardRoute({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser(["supervisor", "manager"]);
  const sp = await searchParams;
  const one = (v: string | string[] | undefined) => (typeof v === "string" ? v : "");
  const lineId = /^\d{1,12}$/.test(one(sp.lineId)) ? one(sp.lineId) : "";
  const date = /^\d{4}-\d{2}-\d{2}$/.test(one(sp.date)) ? one(sp.date) : "";
  return (
    <div className="space-y-4">
      <div>
        <h1>Day board</h1>
        <p className="mt-1 text-sm text-ink-soft">
          One line&apos;s runs for a day in the order they go on: colour changes in the booth between them, and how much of each shift they fill.
        </p>
      </div>
      <DayBoard initialLineId={lineId} initialDate={date} canReorder={hasRole(user, ["supervisor"])} />
    </div>
  );
}
