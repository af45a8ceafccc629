"use client";
import { useRouter } from "next/navigation";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { CoatingEditor } from "./coating-editor";

export function NewCoating({ unitSystem, currency }: { unitSystem: UnitSystem; currency: string }) {
  const router = useRouter();
  return (
    <CoatingEditor
      unitSystem={unitSystem}
      currency={currency}
      onCancel={() => router.push("/coatings")}
      onSaved={(c) => router.push(`/coatings/${c.id}`)}
    />
  );
}
