// `npm run bench`: every benchmark in bench/, one after the other, each printing its figures and
// its ratios against a baseline measured in the same run. Nothing here fails on timing.

import { printRackBench, runRackBench } from "./rack";

type StlBench = (options?: { log?: (text: string) => void }) => Promise<unknown>;

async function main(): Promise<void> {
  printRackBench(runRackBench());
  console.log("");

  // The STL benchmark belongs to the mesh work; run it when its module is there and ready.
  let runStlBench: StlBench | undefined;
  try {
    const mod = (await import("./stl")) as { runStlBench?: unknown };
    if (typeof mod.runStlBench === "function") runStlBench = mod.runStlBench as StlBench;
  } catch (error) {
    console.log(`STL benchmark skipped: bench/stl.ts could not be loaded (${error instanceof Error ? error.message : String(error)}).`);
    return;
  }
  if (!runStlBench) {
    console.log("STL benchmark skipped: bench/stl.ts does not export runStlBench yet.");
    return;
  }
  await runStlBench();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
