/**
 * Measures an STL file on disk. Kept apart from stl-measure.ts so that the measurer itself
 * stays free of Node APIs.
 */
import { open } from "node:fs/promises";
import type { StlUnit } from "./length-units";
import { createStlMeasurer, type StlMeasurement } from "./stl-measure";

/** One buffer, reused for every read: memory stays flat whatever the file size. */
export const STL_READ_BUFFER_BYTES = 1 << 20;

export async function measureStlFile(
  path: string,
  unit: StlUnit,
  options: { closedCheck?: boolean } = {},
): Promise<StlMeasurement> {
  const handle = await open(path, "r");
  try {
    const { size } = await handle.stat();
    const measurer = createStlMeasurer({ unit, closedCheck: options.closedCheck, totalBytes: size });
    const buffer = new Uint8Array(Math.min(STL_READ_BUFFER_BYTES, Math.max(size, 1)));
    for (;;) {
      const { bytesRead } = await handle.read(buffer, 0, buffer.length, null);
      if (bytesRead === 0) break;
      measurer.push(buffer.subarray(0, bytesRead));
    }
    return measurer.finish();
  } finally {
    await handle.close();
  }
}
