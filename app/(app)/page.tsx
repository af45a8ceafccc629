import Link from "next/link";
import { requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { navFor } from "@/lib/navigation";
import type { Role } from "@/db/schema";
import { StockAttention } from "@/components/coatings/stock-attention";
import { RunningOutPanel } from "@/components/forecast/running-out-panel";
import { UtilisationHomePanel } from "@/components/feedback/utilisation-home-panel";
import { TodayRuns } from "@/components/runs/today-runs";
import { ThroughputHomePanel } from "@/components/throughput/home-panel";
import { homeThroughput } from "@/lib/server/throughput";

export const metadata = { title: "Today" };

const roleJobs: Record<Role, string> = {
  admin: "Manage users and plant settings; you can see and change everything.",
  manager: "Compare lines and what-if scenarios: parts per hour, cost per part, the limiting stage.",
  supervisor: "Plan tomorrow's runs: parts, carriers, line speed, colour order and enough cure time.",
  engineer: "Bring new parts in: surface area from STL files or dimensions, weight, and how they hang.",
  purchaser: "Keep powder and e-coat paint in stock without overbuying: forecast, order, receive.",
  operator: "Read the run sheet, record film thickness readings and the material actually used.",
};

export default async function HomePage() {
  const user = await requirePageUser();
  const plant = await plantSettings();
  const sections = navFor(user.role).filter((i) => i.href !== "/");
  return (
    <div className="space-y-6">
      <div>
        <h1>Good to see you, {user.name.split(" ")[0]}</h1>
        <p className="mt-1 text-ink-soft">
          {plant.plantName} · {plant.shiftHours} h shift · signed in as <span className="capitalize">{user.role}</span>
        </p>
      </div>
      <section className="card" aria-labelledby="job-h">
        <h2 id="job-h">Your work here</h2>
        <p className="mt-1 text-sm">{roleJobs[user.role]}</p>
        <ul className="mt-3 flex flex-wrap gap-2">
          {sections.map((s) => (
            <li key={s.href}><Link className="btn-quiet" href={s.href}>{s.label}</Link></li>
          ))}
        </ul>
      </section>
      {(user.role === "supervisor" || user.role === "operator" || user.role === "admin") && <TodayRuns showBoard={user.role !== "operator"} floor={user.role === "operator"} />}
      {(user.role === "purchaser" || user.role === "admin") && <StockAttention unitSystem={user.unitSystem} />}
      {(user.role === "purchaser" || user.role === "admin") && <RunningOutPanel unitSystem={user.unitSystem} />}
      {(user.role === "manager" || user.role === "admin") && <UtilisationHomePanel />}
      {(user.role === "manager" || user.role === "admin") && <ThroughputHomePanel data={await homeThroughput(user.unitSystem)} />}
    </div>
  );
}
