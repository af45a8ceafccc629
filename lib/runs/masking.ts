/** A run's free-text masking list → one item per line, blanks and bullets dropped. Imports nothing, so screens can use it cheaply. */
export function maskingItems(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((l) => l.replace(/^\s*[-*•]\s*/, "").trim())
    .filter(Boolean);
}
