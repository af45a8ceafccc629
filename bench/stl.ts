/**
 * STL measurement benchmark. Run: `npx tsx bench/stl.ts` (or through bench/run.ts).
 *
 * Writes a 1,000,000-triangle binary STL and a 200,000-triangle ASCII STL into a temp folder,
 * then times, each in its own child process (so peak RSS is clean):
 *   - ours: measureStlFile, without and with the closed-mesh check;
 *   - three.js: read the file, STLLoader.parse, then sum triangle areas;
 *   - floor: read the file into one reused 1 MiB buffer and sum its 32-bit words.
 * Prints ratios against the three.js and floor baselines measured in the same run.
 */
import { fork } from "node:child_process";
import { mkdtemp, open, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { measureStlFile } from "../lib/geometry/stl-file";
import { writeAsciiTorusStl, writeBinaryTorusStl } from "./stl-generate";

const CHILD_FLAG = "--stl-bench-child";
/** Runs per child; the best one counts (the machine may be shared). three.js is slow: fewer. */
const REPEATS: Record<string, number> = { floor: 7, "floor-overlapped": 7, ours: 7, "ours-closed": 5, three: 3 };
const THIS_FILE = fileURLToPath(import.meta.url);

type Task = "ours" | "ours-closed" | "three" | "floor" | "floor-overlapped";

interface TaskFigures {
  task: Task;
  /** best of REPEATS[task] wall-clock runs */
  bestMs: number;
  /** first (cold JIT) run */
  firstMs: number;
  /** peak resident set of the child minus its resident set just before the first run */
  peakRssDeltaMb: number;
  peakRssMb: number;
  /** a number derived from the work, printed so that nothing is optimised away */
  check: number;
}

export interface StlBenchReport {
  binary: Record<Task, TaskFigures>;
  ascii: Record<Task, TaskFigures>;
  ratios: {
    binarySpeedupVsThree: number;
    binaryClosedSpeedupVsThree: number;
    binaryOursOverFloor: number;
    binaryOursOverOverlappedFloor: number;
    asciiSpeedupVsThree: number;
    asciiClosedSpeedupVsThree: number;
    closedCheckMs: number;
    closedCheckMb: number;
  };
}

const MB = 1024 * 1024;

// Four independent double sums, so that the floor is bound by memory, not by one chain of
// dependent additions (`(sum + w) | 0` would be slower still in V8: overflow checks).
// No separate loop for a remainder: a loop that never ran while V8 warmed up costs a
// deoptimisation on every call once it does (seen here with --trace-deopt).
function sumWords(words: Int32Array, n: number, sum: number): number {
  const whole = (n + 3) & ~3; // the read buffer is a multiple of 16 bytes
  words.fill(0, n, whole);
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
  for (let i = 0; i < whole; i += 4) {
    s0 += words[i];
    s1 += words[i + 1];
    s2 += words[i + 2];
    s3 += words[i + 3];
  }
  return sum + s0 + s1 + s2 + s3;
}

async function floorRead(path: string): Promise<number> {
  const handle = await open(path, "r");
  const buffer = new Uint8Array(1 << 20);
  const words = new Int32Array(buffer.buffer);
  let sum = 0;
  try {
    for (;;) {
      const { bytesRead } = await handle.read(buffer, 0, buffer.length, null);
      if (bytesRead === 0) break;
      sum = sumWords(words, bytesRead >>> 2, sum);
    }
  } finally {
    await handle.close();
  }
  return sum;
}

/**
 * The floor with the same read pattern as measureStlFile: two reused buffers, the next read in
 * flight while the words of the last are summed. The floor reads and sums in turn, so
 * ours, which overlaps the two, can beat it; this one it cannot.
 */
async function floorReadOverlapped(path: string): Promise<number> {
  const handle = await open(path, "r");
  const buffers = [new Uint8Array(1 << 20), new Uint8Array(1 << 20)];
  const words = buffers.map((b) => new Int32Array(b.buffer));
  let sum = 0;
  let turn = 0;
  try {
    let pending = handle.read(buffers[turn], 0, 1 << 20, null);
    for (;;) {
      const { bytesRead } = await pending;
      if (bytesRead === 0) break;
      const ready = turn;
      turn ^= 1;
      pending = handle.read(buffers[turn], 0, 1 << 20, null);
      sum = sumWords(words[ready], bytesRead >>> 2, sum);
    }
  } finally {
    await handle.close();
  }
  return sum;
}

async function threeArea(path: string): Promise<number> {
  const { STLLoader } = await import("three/examples/jsm/loaders/STLLoader.js");
  const file = await readFile(path);
  const arrayBuffer = file.buffer.slice(file.byteOffset, file.byteOffset + file.byteLength);
  const geometry = new STLLoader().parse(arrayBuffer as ArrayBuffer);
  const p = geometry.getAttribute("position").array as Float32Array;
  let doubleArea = 0;
  for (let i = 0; i < p.length; i += 9) {
    const ux = p[i + 3] - p[i], uy = p[i + 4] - p[i + 1], uz = p[i + 5] - p[i + 2];
    const vx = p[i + 6] - p[i], vy = p[i + 7] - p[i + 1], vz = p[i + 8] - p[i + 2];
    const nx = uy * vz - uz * vy, ny = uz * vx - ux * vz, nz = ux * vy - uy * vx;
    doubleArea += Math.sqrt(nx * nx + ny * ny + nz * nz);
  }
  return (doubleArea / 2) * 1e-6;
}

async function runTask(task: Task, path: string): Promise<number> {
  switch (task) {
    case "ours":
      return (await measureStlFile(path, "mm", { closedCheck: false })).areaM2;
    case "ours-closed": {
      const r = await measureStlFile(path, "mm", { closedCheck: true });
      if (!r.closed) throw new Error("benchmark torus should be closed");
      return r.areaM2;
    }
    case "three":
      return threeArea(path);
    case "floor":
      return floorRead(path);
    case "floor-overlapped":
      return floorReadOverlapped(path);
  }
}

async function childMain(task: Task, path: string): Promise<void> {
  // Load three's module before the baseline so its code size is not counted as data.
  if (task === "three") await import("three/examples/jsm/loaders/STLLoader.js");
  const baseRssKb = process.resourceUsage().maxRSS;
  const startRssMb = process.memoryUsage().rss / MB;
  let t0 = performance.now();
  const check = await runTask(task, path);
  const firstMs = performance.now() - t0;
  const peakRssMb = process.resourceUsage().maxRSS / 1024;
  let bestMs = firstMs;
  for (let i = 1; i < REPEATS[task]; i++) {
    t0 = performance.now();
    await runTask(task, path);
    bestMs = Math.min(bestMs, performance.now() - t0);
  }
  const figures: TaskFigures = {
    task,
    bestMs,
    firstMs,
    peakRssMb,
    peakRssDeltaMb: peakRssMb - Math.max(startRssMb, baseRssKb / 1024),
    check,
  };
  process.send!(figures);
}

function inChild(task: Task, path: string): Promise<TaskFigures> {
  // Children need the same TypeScript loader as this process (tsx puts it in execArgv).
  const execArgv = process.execArgv.some((a) => a.includes("tsx")) ? process.execArgv : ["--import", "tsx"];
  return new Promise((resolve, reject) => {
    const child = fork(THIS_FILE, [CHILD_FLAG, task, path], { execArgv, stdio: ["ignore", "inherit", "inherit", "ipc"] });
    let figures: TaskFigures | null = null;
    child.on("message", (m) => (figures = m as TaskFigures));
    child.on("error", reject);
    child.on("exit", (code) =>
      figures ? resolve(figures) : reject(new Error(`benchmark child ${task} exited with code ${code}`)),
    );
  });
}

async function measureAll(path: string): Promise<Record<Task, TaskFigures>> {
  const out = {} as Record<Task, TaskFigures>;
  // One at a time: two cores, and each child's RSS must be its own.
  for (const task of ["floor", "floor-overlapped", "ours", "ours-closed", "three"] as Task[]) out[task] = await inChild(task, path);
  return out;
}

function line(label: string, f: TaskFigures): string {
  return `  ${label.padEnd(28)} best ${f.bestMs.toFixed(0).padStart(6)} ms  first ${f.firstMs.toFixed(0).padStart(6)} ms  peak RSS ${f.peakRssMb.toFixed(0).padStart(5)} MB (+${f.peakRssDeltaMb.toFixed(0)} MB)`;
}

export async function runStlBench(
  options: { binaryTriangles?: number; asciiTriangles?: number; log?: (text: string) => void } = {},
): Promise<StlBenchReport> {
  const log = options.log ?? ((text: string) => console.log(text));
  const binaryTriangles = options.binaryTriangles ?? 1_000_000;
  const asciiTriangles = options.asciiTriangles ?? 200_000;
  const dir = await mkdtemp(join(tmpdir(), "coatwright-stl-bench-"));
  try {
    const binaryPath = join(dir, "torus-binary.stl");
    const asciiPath = join(dir, "torus-ascii.stl");
    // torus of 2 n m triangles with n = 2 m
    const side = (t: number) => Math.max(2, Math.round(Math.sqrt(t / 4)));
    const nb = await writeBinaryTorusStl(binaryPath, 2 * side(binaryTriangles), side(binaryTriangles));
    const na = await writeAsciiTorusStl(asciiPath, 2 * side(asciiTriangles), side(asciiTriangles));
    log(`STL benchmark (Node ${process.version}; best of ${REPEATS.ours} runs, three.js ${REPEATS.three}; each task in its own process)`);
    log(`binary STL, ${nb.toLocaleString("en-US")} triangles:`);
    const binary = await measureAll(binaryPath);
    log(line("floor (read + sum words)", binary.floor));
    log(line("floor, overlapped reads", binary["floor-overlapped"]));
    log(line("ours, area/volume/bbox", binary.ours));
    log(line("ours + closed check", binary["ours-closed"]));
    log(line("three.js STLLoader + area", binary.three));
    log(`ASCII STL, ${na.toLocaleString("en-US")} triangles:`);
    const ascii = await measureAll(asciiPath);
    log(line("floor (read + sum words)", ascii.floor));
    log(line("floor, overlapped reads", ascii["floor-overlapped"]));
    log(line("ours, area/volume/bbox", ascii.ours));
    log(line("ours + closed check", ascii["ours-closed"]));
    log(line("three.js STLLoader + area", ascii.three));

    const ratios = {
      binarySpeedupVsThree: binary.three.bestMs / binary.ours.bestMs,
      binaryClosedSpeedupVsThree: binary.three.bestMs / binary["ours-closed"].bestMs,
      binaryOursOverFloor: binary.ours.bestMs / binary.floor.bestMs,
      binaryOursOverOverlappedFloor: binary.ours.bestMs / binary["floor-overlapped"].bestMs,
      asciiSpeedupVsThree: ascii.three.bestMs / ascii.ours.bestMs,
      asciiClosedSpeedupVsThree: ascii.three.bestMs / ascii["ours-closed"].bestMs,
      closedCheckMs: binary["ours-closed"].bestMs - binary.ours.bestMs,
      closedCheckMb: binary["ours-closed"].peakRssDeltaMb - binary.ours.peakRssDeltaMb,
    };
    log("ratios:");
    log(`  binary speedup vs three.js      ${ratios.binarySpeedupVsThree.toFixed(1)}x (with closed check ${ratios.binaryClosedSpeedupVsThree.toFixed(1)}x; target >= 20x)`);
    log(`  binary ours / floor             ${ratios.binaryOursOverFloor.toFixed(2)}x (target <= 1.3x)`);
    log(`  binary ours / overlapped floor  ${ratios.binaryOursOverOverlappedFloor.toFixed(2)}x (the same two-buffer reads as ours)`);
    log(`  ASCII speedup vs three.js       ${ratios.asciiSpeedupVsThree.toFixed(1)}x (with closed check ${ratios.asciiClosedSpeedupVsThree.toFixed(1)}x; target >= 10x)`);
    log(`  closed check, ${nb.toLocaleString("en-US")} triangles: +${ratios.closedCheckMs.toFixed(0)} ms, +${ratios.closedCheckMb.toFixed(0)} MB peak RSS (target < 1000 ms, < 100 MB)`);
    const areas = [binary.ours.check, binary["ours-closed"].check, binary.three.check];
    log(`  (areas agree: ours ${areas[0].toFixed(6)} m², three.js ${areas[2].toFixed(6)} m²)`);
    return { binary, ascii, ratios };
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

const childAt = process.argv.indexOf(CHILD_FLAG);
if (childAt !== -1) {
  childMain(process.argv[childAt + 1] as Task, process.argv[childAt + 2]).catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
} else if (process.argv[1] && resolve(process.argv[1]).replace(/\.ts$/, "") === THIS_FILE.replace(/\.ts$/, "")) {
  runStlBench().catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });
}
