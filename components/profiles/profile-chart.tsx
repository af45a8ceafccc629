"use client";
import { CartesianGrid, Legend, Line, LineChart, ReferenceArea, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { PROBE_COLOURS, tempShown, tempUnit } from "./profile-units";

export interface ProfileChartProps {
  timeS: number[];
  airC: number[];
  probes: { label: string; tempsC: number[]; modelC: number[] | null }[];
  /** the cure schedule's lowest and highest metal temperatures: the shaded window */
  cureWindowC: [number, number];
  overbakeLimitC: number | null;
  unitSystem: UnitSystem;
  /** a fixed width for printing (the page narrows without a resize the chart would see in time) */
  widthPx?: number;
}

const AIR_COLOUR = "#6b7884";

/** Temperature against time: air, each probe, each probe's fitted model dashed, the cure window shaded. */
export function ProfileChart({ timeS, airC, probes, cureWindowC, overbakeLimitC, unitSystem: sys, widthPx }: ProfileChartProps) {
  const t = (c: number) => Math.round(tempShown(c, sys) * 10) / 10;
  const data = timeS.map((s, i) => {
    const row: Record<string, number | null> = { min: Math.round((s / 60) * 1000) / 1000, air: t(airC[i]) };
    probes.forEach((p, k) => {
      row[`p${k}`] = t(p.tempsC[i]);
      row[`m${k}`] = p.modelC ? t(p.modelC[i]) : null;
    });
    return row;
  });
  const unit = tempUnit(sys);
  const size = widthPx ? { width: widthPx, height: 340 } : { width: "100%", height: 380 };
  return (
    <LineChart data={data} responsive={!widthPx} style={size} margin={{ top: 8, right: 16, bottom: 8, left: 8 }}>
      <CartesianGrid stroke="#e8e9e3" />
      <ReferenceArea
        y1={t(cureWindowC[0])}
        y2={t(cureWindowC[1])}
        fill="#d8ebe7"
        fillOpacity={0.8}
        ifOverflow="extendDomain"
        label={{ value: "Cure window", position: "insideTopLeft", fill: "#144c46", fontSize: 12 }}
      />
      {overbakeLimitC !== null && (
        <ReferenceLine y={t(overbakeLimitC)} stroke="#a8461f" strokeDasharray="2 3" ifOverflow="extendDomain" label={{ value: "Over-bake limit", position: "insideTopRight", fill: "#a8461f", fontSize: 12 }} />
      )}
      <XAxis dataKey="min" type="number" domain={[0, "dataMax"]} tickCount={10} allowDecimals={false} label={{ value: "Time (min)", position: "insideBottom", offset: -4 }} height={40} />
      <YAxis width={56} label={{ value: unit, angle: -90, position: "insideLeft" }} domain={[0, "auto"]} tickCount={7} allowDecimals={false} />
      <Tooltip formatter={(v) => (typeof v === "number" ? `${v} ${unit}` : String(v))} labelFormatter={(v) => `${v} min`} />
      <Legend verticalAlign="top" height={28} itemSorter={null} />
      <Line dataKey="air" name="Air" stroke={AIR_COLOUR} strokeWidth={1.5} dot={false} isAnimationActive={false} />
      {probes.map((p, k) => (
        // measured: wide and pale, so the fitted model's dashes stay visible where the two agree
        <Line key={`p${k}`} dataKey={`p${k}`} name={p.label} stroke={PROBE_COLOURS[k % PROBE_COLOURS.length]} strokeWidth={4} strokeOpacity={0.4} dot={false} isAnimationActive={false} />
      ))}
      {probes.map((p, k) =>
        p.modelC ? (
          <Line
            key={`m${k}`}
            dataKey={`m${k}`}
            name={`${p.label}, fitted model`}
            stroke={PROBE_COLOURS[k % PROBE_COLOURS.length]}
            strokeWidth={1.5}
            strokeDasharray="5 4"
            dot={false}
            isAnimationActive={false}
            legendType="plainline"
          />
        ) : null,
      )}
    </LineChart>
  );
}
