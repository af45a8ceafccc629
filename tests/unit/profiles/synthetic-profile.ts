/**
 * Synthetic oven profiles for tests: metal temperatures integrated from the lumped model
 * (Çengel, Heat Transfer, ch. 4: ρ c L_c dT/dt = h (T_air − T), L_c = thickness/2) with a fine
 * fourth-order Runge–Kutta step — a different method from the library's closed-form stepping, so
 * the two check each other. Written independently of lib/profiles on purpose.
 */

export interface SyntheticProbe {
  label: string;
  thicknessMm: number;
  hWPerM2K: number;
}

export interface SyntheticOptions {
  durationS: number;
  sampleS: number;
  airC: (tS: number) => number;
  startC: number;
  probes: SyntheticProbe[];
  /** uniform noise ±noiseK added to every reading (air and probes), deterministic from seed */
  noiseK?: number;
  seed?: number;
  densityKgPerM3?: number;
  specificHeatJPerKgK?: number;
}

export interface SyntheticProfile {
  timeS: number[];
  airC: number[];
  probes: { label: string; thicknessMm: number; tempsC: number[] }[];
}

/** mulberry32: a tiny deterministic generator, so noisy profiles are the same every run. */
export function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function syntheticProfile(o: SyntheticOptions): SyntheticProfile {
  const rho = o.densityKgPerM3 ?? 7850;
  const c = o.specificHeatJPerKgK ?? 490;
  const rnd = random(o.seed ?? 1);
  const noise = () => (o.noiseK ? (rnd() * 2 - 1) * o.noiseK : 0);
  const steps = Math.round(o.durationS / o.sampleS);
  const timeS = Array.from({ length: steps + 1 }, (_, i) => i * o.sampleS);
  const sub = 50;
  const probes = o.probes.map((p) => {
    const k = p.hWPerM2K / (rho * c * (p.thicknessMm / 2000));
    const f = (t: number, T: number) => k * (o.airC(t) - T);
    let T = o.startC;
    const temps = [T];
    for (let i = 1; i <= steps; i += 1) {
      const dt = o.sampleS / sub;
      for (let j = 0; j < sub; j += 1) {
        const t = timeS[i - 1] + j * dt;
        const k1 = f(t, T);
        const k2 = f(t + dt / 2, T + (dt / 2) * k1);
        const k3 = f(t + dt / 2, T + (dt / 2) * k2);
        const k4 = f(t + dt, T + dt * k3);
        T += (dt / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
      }
      temps.push(T);
    }
    return { label: p.label, thicknessMm: p.thicknessMm, tempsC: temps.map((v) => v + noise()) };
  });
  return { timeS, airC: timeS.map((t) => o.airC(t) + noise()), probes };
}

/** Air ramping linearly from `fromC` to `toC` over `rampS`, then holding. */
export const rampAir = (fromC: number, toC: number, rampS: number) => (t: number) => (t >= rampS ? toC : fromC + ((toC - fromC) * t) / rampS);

/**
 * A conveyor pass through a powder cure oven (invented): a minute outside at 24 °C, 20 min in the
 * oven whose air the logger sees climb to ~211 °C with a zone ripple, then the cool-down tunnel.
 */
export function conveyorOvenAir(t: number): number {
  const enter = 60;
  const exit = enter + 20 * 60;
  const inside = (s: number) => 24 + (211 - 24) * (1 - Math.exp(-(s - enter) / 45)) + 1.5 * Math.sin((2 * Math.PI * (s - enter)) / 300);
  if (t < enter) return 24;
  if (t <= exit) return inside(t);
  return 30 + (inside(exit) - 30) * Math.exp(-(t - exit) / 50);
}

export interface CsvOptions {
  unit?: "C" | "F";
  timeFormat?: "seconds" | "minutes" | "clock";
  /** clock time of the first reading, seconds after midnight */
  startClockS?: number;
  headers?: { time?: string; air?: string; probes?: string[] };
  delimiter?: string;
  preamble?: string[];
}

const pad = (n: number) => String(Math.floor(n)).padStart(2, "0");

/** The profile as a logger CSV. °F by definition: F = C × 9/5 + 32 (NIST SP 811). */
export function toCsv(p: SyntheticProfile, o: CsvOptions = {}): string {
  const unit = o.unit ?? "C";
  const fmt = o.timeFormat ?? "seconds";
  const d = o.delimiter ?? ",";
  const temp = (c: number) => (unit === "F" ? (c * 9) / 5 + 32 : c).toFixed(2);
  const time = (s: number) => {
    if (fmt === "minutes") return (s / 60).toFixed(6);
    if (fmt === "clock") {
      const t = ((o.startClockS ?? 8 * 3600) + s) % 86_400;
      return `${pad(t / 3600)}:${pad((t % 3600) / 60)}:${pad(t % 60)}`;
    }
    return String(s);
  };
  const header = [
    o.headers?.time ?? (fmt === "clock" ? "Time" : fmt === "minutes" ? "Elapsed (min)" : "Elapsed (s)"),
    o.headers?.air ?? `T1 Air (°${unit})`,
    ...p.probes.map((_, i) => o.headers?.probes?.[i] ?? `T${i + 2} (°${unit})`),
  ];
  const lines = [...(o.preamble ?? []), header.join(d)];
  p.timeS.forEach((t, i) => lines.push([time(t), temp(p.airC[i]), ...p.probes.map((q) => temp(q.tempsC[i]))].join(d)));
  return lines.join("\n") + "\n";
}

/** The demo pass: a thin 1.5 mm bracket that cures and a thick 8 mm base plate that does not, in an oven whose true h is 24 W/m²K. */
export function demoProfile(noiseK = 0.3): SyntheticProfile {
  return syntheticProfile({
    durationS: 26 * 60,
    sampleS: 10,
    airC: conveyorOvenAir,
    startC: 24,
    noiseK,
    seed: 7,
    probes: [
      { label: "Thin bracket", thicknessMm: 1.5, hWPerM2K: 24 },
      { label: "Thick base plate", thicknessMm: 8, hWPerM2K: 24 },
    ],
  });
}
