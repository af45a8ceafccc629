/**
 * Fetches a stored STL and turns it into triangle positions in mm (x, y, z per vertex, three
 * vertices per triangle, the file's own frame). three.js's STLLoader is imported on demand, so
 * a page only fetches three.js once it actually draws a mesh.
 */
import { convert } from "@/lib/coating-math/display-units";

export async function loadPartMesh(meshId: string, unit: "mm" | "in", signal?: AbortSignal): Promise<Float32Array> {
  const res = await fetch(`/api/meshes/${encodeURIComponent(meshId)}/file`, { signal });
  if (!res.ok) throw new Error(res.status === 404 ? "The mesh file is missing." : `The mesh could not be loaded (${res.status}).`);
  const bytes = await res.arrayBuffer();
  const { STLLoader } = await import("three/examples/jsm/loaders/STLLoader.js");
  const geometry = new STLLoader().parse(bytes);
  const positions = geometry.getAttribute("position").array as Float32Array;
  geometry.dispose();
  if (unit === "in") {
    const mmPerIn = convert(1, "inch", "mm");
    for (let i = 0; i < positions.length; i++) positions[i] *= mmPerIn;
  }
  return positions;
}
