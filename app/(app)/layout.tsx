import Link from "next/link";
import { connection } from "next/server";
import { requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { navFor } from "@/lib/navigation";
import { SwrProvider } from "@/components/swr-provider";
import { SignOutButton } from "@/components/sign-out-button";
import { NavLinks } from "@/components/nav-links";
import { UnitSwitch } from "@/components/unit-switch";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  await connection();
  const user = await requirePageUser();
  const plant = await plantSettings();
  const visible = navFor(user.role);
  const pick = (area: "account" | undefined) => visible.filter((i) => i.area === area).map(({ href, label }) => ({ href, label }));
  const sections = pick(undefined);
  const account = pick("account");
  return (
    <SwrProvider>
      <div className="min-h-screen">
        <a
          href="#main"
          className="no-print sr-only rounded bg-plate px-3 py-2 text-ink focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50"
        >
          Skip to content
        </a>
        <header className="no-print border-b border-plate-line bg-ink text-plate">
          <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 pt-2">
            <Link href="/" className="flex items-baseline gap-2 font-semibold tracking-tight">
              <span className="text-lg">Coatwright</span>
              <span className="text-xs font-normal text-plate/70">{plant.plantName}</span>
            </Link>
            <div className="ml-auto flex flex-wrap items-center gap-3 text-sm">
              <NavLinks items={account} label="Account and administration" />
              <UnitSwitch initial={user.unitSystem} />
              <span data-testid="current-user">
                {user.name} · <span className="capitalize">{user.role}</span>
              </span>
              <SignOutButton />
            </div>
          </div>
          <div className="mx-auto max-w-7xl px-4 pb-2 pt-1">
            <NavLinks items={sections} />
          </div>
        </header>
        <main id="main" className="mx-auto max-w-7xl px-4 py-6">{children}</main>
      </div>
    </SwrProvider>
  );
}
