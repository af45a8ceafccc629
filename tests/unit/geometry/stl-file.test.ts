import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GeometryError } from "@/lib/geometry/errors";
import { measureStlFile, STL_READ_BUFFER_BYTES } from "@/lib/geometry/stl-file";
import { measureStlBuffer } from "@/lib/geometry/stl-measure";
import { boxMesh, toAsciiStl, toBinaryStl, torusMesh } from "./stl-fixtures";

let dir = "";
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "coatwright-stl-test-"));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe("measureStlFile", () => {
  it("reads a file larger than its read buffer in pieces and matches the in-memory result", async () => {
    // 2 x 160 x 120 = 38,400 triangles: 1.9 MB binary, several MB ASCII
    const mesh = torusMesh(100, 20, 160, 120);
    for (const [name, bytes] of [
      ["torus.stl", toBinaryStl(mesh, { header: "solid torus" })],
      ["torus-ascii.stl", toAsciiStl(mesh)],
    ] as const) {
      expect(bytes.length).toBeGreaterThan(STL_READ_BUFFER_BYTES);
      const path = join(dir, name);
      await writeFile(path, bytes);
      const fromFile = await measureStlFile(path, "mm");
      expect(fromFile).toEqual(measureStlBuffer(bytes, "mm"));
      expect(fromFile.triangleCount).toBe(38_400);
      expect(fromFile.closed).toBe(true);
    }
  });

  it("gives the same errors as the buffer version", async () => {
    const path = join(dir, "cut.stl");
    await writeFile(path, toBinaryStl(boxMesh(1, 2, 3)).subarray(0, 200));
    await expect(measureStlFile(path, "in")).rejects.toMatchObject({ code: "truncated", field: "file" });
    const empty = join(dir, "empty.stl");
    await writeFile(empty, new Uint8Array(0));
    await expect(measureStlFile(empty, "mm")).rejects.toBeInstanceOf(GeometryError);
    await expect(measureStlFile(empty, "mm")).rejects.toMatchObject({ code: "empty_file" });
  });

  it("stops at a bad coordinate in the first read while the next read is still under way", async () => {
    // A NaN in the first buffer's bytes, a second buffer's worth still to come. // common practice, no source
    const mesh = torusMesh(100, 20, 160, 120);
    const bytes = toBinaryStl(mesh);
    expect(bytes.length).toBeGreaterThan(STL_READ_BUFFER_BYTES);
    new DataView(bytes.buffer, bytes.byteOffset).setFloat32(84 + 50 * 10 + 12, Number.NaN, true);
    const path = join(dir, "nan.stl");
    await writeFile(path, bytes);
    await expect(measureStlFile(path, "mm")).rejects.toBeInstanceOf(GeometryError);
    // the handle was closed cleanly: the same file can be measured again with the same answer
    await expect(measureStlFile(path, "mm")).rejects.toBeInstanceOf(GeometryError);
  });
});
