"use client";
import { useRouter } from "next/navigation";
import type { LineView } from "@/lib/server/lines";
import { ArchivePanel } from "@/components/ui/archive-panel";

/** Archive a line, with a confirmation; a line still used by planned runs is refused with the list. */
export function ArchiveLine({ line }: { line: LineView }) {
  const router = useRouter();
  return (
    <ArchivePanel
      url={`/api/lines/${line.id}`}
      name={line.name}
      headingId="archive-line-h"
      explanation="An archived line leaves the list and cannot be picked for new runs; its data stays."
      onArchived={() => router.push("/lines")}
    />
  );
}
