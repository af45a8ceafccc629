/** "3 Dec 2026, 14:05" in the browser's time zone (client components only: the server has none). */
export function whenText(epochS: number): string {
  return new Date(epochS * 1000).toLocaleString("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });
}
