import { describe, expect, it } from "vitest";
import { rackReason, rackReasonUnits, type RackReasonFacts } from "@/lib/rack/explain";

// source: NIST SP 811 (1 lb = 0.45359237 kg exactly, 1 in = 25.4 mm exactly); the counts are the
// planner's, the sentences our own wording.
const facts: RackReasonFacts = {
  part: { lengthMm: 600, widthMm: 400, heightMm: 254, massKg: 30 },
  windowMm: [1200, 1800, 600],
  maxLoadKg: 250,
  clearanceMm: 50.8,
  orientations: "any",
  count: 7,
  spaceCount: 9,
  limitedBy: "load",
  blocks: [{ grid: [3, 3, 1] }],
};

describe("racking reason in the reader's units", () => {
  it("words the load limit in kg by default and in lb for US readers", () => {
    expect(rackReason(facts)).toBe("The 250 kg load limit allows 7 of the 9 parts that fit.");
    expect(rackReason(facts, rackReasonUnits("metric"))).toBe(rackReason(facts));
    // 250 / 0.45359237 = 551.16 lb → 551.2 lb to 4 significant figures
    expect(rackReason(facts, rackReasonUnits("us"))).toBe("The 551.2 lb load limit allows 7 of the 9 parts that fit.");
  });

  it("words a part too large for the window, and the clearance, in inches", () => {
    const none = { ...facts, count: 0, spaceCount: 0, limitedBy: "space" as const };
    expect(rackReason(none)).toBe("The part (600 × 400 × 254 mm) is larger than the 1200 × 1800 × 600 mm window in every orientation.");
    // 600 mm = 23.62 in, 400 mm = 15.75 in, 254 mm = 10 in; 1200 mm = 47.24 in, 1800 mm = 70.87 in
    expect(rackReason(none, rackReasonUnits("us"))).toBe(
      "The part (23.62 in × 15.75 in × 10 in) is larger than the 47.24 in × 70.87 in × 23.62 in window in every orientation.",
    );
    const space = { ...facts, count: 9, limitedBy: "space" as const };
    // 50.8 mm = 2 in
    expect(rackReason(space, rackReasonUnits("us"))).toBe("Space limits the carrier to 9 parts: 3 along travel × 3 tiers × 1 across, 2 in clearance.");
  });
});
