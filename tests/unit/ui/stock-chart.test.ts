import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { StockChart } from "@/components/forecast/stock-chart";

// source: NIST SP 811 (1 lb = 0.45359237 kg); the chart's marks are our own design.
const series = ["2026-12-02", "2026-12-03", "2026-12-04"].map((date) => ({ date, stockKg: 0 }));

describe("forecast stock chart", () => {
  it("marks the day stock runs out and the shortfall, which a line held at zero cannot show", () => {
    const html = renderToStaticMarkup(
      createElement(StockChart, { code: "PP-420", series, reorderPointKg: 120, stockOutDate: "2026-12-02", shortfallKg: 9.57, unitSystem: "us" }),
    );
    // 9.57 kg / 0.45359237 = 21.098 lb → 21.1 lb
    expect(html).toContain('data-testid="stock-out-mark"');
    expect(html).toContain("runs out 2026-12-02: 21.1 lb short");
    expect(html).toContain("the runs need 21.1 lb more than there is");
  });

  it("shows no mark when the stock lasts", () => {
    const html = renderToStaticMarkup(
      createElement(StockChart, { code: "PP-410", series: series.map((p) => ({ ...p, stockKg: 50 })), reorderPointKg: 20, stockOutDate: null, shortfallKg: 0, unitSystem: "metric" }),
    );
    expect(html).not.toContain("stock-out-mark");
    expect(html).not.toContain("runs out");
  });
});
