/**
 * Measures an STL file on disk. Kept apart from stl-measure.ts so that the measurer itself
 * stays free of Node APIs.
 */
import { open } from "node:fs/promises";
import type { StlUnit } from "./length-units";
import { createStlMeasurer, type StlMeasurement } from "./stl-measure";

/** Each of the two read buffers; both are reused for every read, so memory stays flat. */
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
    const bytes = Math.min(STL_READ_BUFFER_BYTES, Math.max(size, 1));
    // Two buffers in turn: the next read runs on libuv's thread pool while this thread measures
    // the bytes already read, so the file costs about its read time rather than read + measure.
    // Only one read is ever outstanding, so reading at the current file position stays in order.
    const buffers = [new Uint8Array(bytes), new Uint8Array(bytes)];
    let turn = 0;
    let pending = handle.read(buffers[turn], 0, bytes, null);
    for (;;) {
      const { bytesRead } = await pending;
      if (bytesRead === 0) break;
      const ready = buffers[turn];
      turn ^= 1;
      pending = handle.read(buffers[turn], 0, bytes, null);
      try {
        measurer.push(ready.subarray(0, bytesRead));
      } catch (error) {
        // let the outstanding read finish before the handle closes
        await pending.catch(() => undefined);
        throw error;
      }
    }
    return measurer.finish();
  } finally {
    await handle.close();
  }
}
