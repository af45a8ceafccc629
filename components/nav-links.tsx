"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";

export function NavLinks({ items, label = "Sections" }: { items: { href: string; label: string }[]; label?: string }) {
  const path = usePathname();
  return (
    <nav aria-label={label}>
      <ul className="flex flex-wrap gap-1 text-sm">
        {items.map((i) => {
          const active = i.href === "/" ? path === "/" : path.startsWith(i.href);
          return (
            <li key={i.href}>
              <Link
                href={i.href}
                aria-current={active ? "page" : undefined}
                className={`rounded px-2 py-1 ${active ? "bg-plate/15 text-white" : "text-plate/80 hover:text-white"}`}
              >
                {i.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
