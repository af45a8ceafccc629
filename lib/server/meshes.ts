/**
 * STL uploads: the multipart body is streamed through busboy to a file under the data folder,
 * and every chunk is fed to lib/geometry's incremental measurer on its way, so a large upload
 * never sits whole in memory. Any failure deletes the partial file and stores no row.
 */
import { randomUUID } from "node:crypto";
import { createReadStream, createWriteStream } from "node:fs";
import { mkdir, readdir, rename, rm, stat } from "node:fs/promises";
import path from "node:path";
import { Readable, Transform } from "node:stream";
import { pipeline } from "node:stream/promises";
import type { ReadableStream as NodeWebReadableStream } from "node:stream/web";
import busboy from "busboy";
import { databasePath, getDb } from "@/db/index";
import {
  deleteUnattachedMeshes,
  findMeshRow,
  insertMesh,
  partNumbersUsingMesh,
  storedMeshNames,
  updateMesh,
  type MeshRow,
} from "@/db/queries/meshes";
import { GeometryError } from "@/lib/geometry/errors";
import { unitFactors, type StlUnit } from "@/lib/geometry/length-units";
import { createStlMeasurer, type StlMeasurement, type StlMeasurer } from "@/lib/geometry/stl-measure";
import { suggestUnit } from "@/lib/geometry/unit-hint";
import { ApiError } from "./http";

export interface MeshView {
  id: string;
  fileName: string;
  unit: StlUnit;
  sizeBytes: number;
  format: "binary" | "ascii";
  triangleCount: number;
  areaM2: number;
  volumeM3: number;
  bboxMm: { x: number; y: number; z: number };
  closed: boolean;
  /** a sentence when the size suggests the file was drawn in the other unit, else null */
  unitHint: string | null;
  createdAt: number;
}

const DEFAULT_MAX_BYTES = 200 * 1024 * 1024;
/** Room for the multipart boundaries and the small fields around the file. */
const MULTIPART_SLACK_BYTES = 64 * 1024;
const UNIT_FIELD_HELP = 'Add the form field "unit" with "mm" or "in": an STL file carries no unit.';

/** The largest STL accepted, from MESH_MAX_BYTES (bytes), default 200 MB. */
export function meshMaxBytes(): number {
  const raw = Number(process.env.MESH_MAX_BYTES);
  return Number.isSafeInteger(raw) && raw > 0 ? raw : DEFAULT_MAX_BYTES;
}

/** Meshes live beside the database file, so a backup of the data folder holds both. */
export function meshDirectory(): string {
  return path.join(path.dirname(databasePath()), "meshes");
}

function storedPath(storedName: string): string {
  // NOTE: stored names are generated here, never taken from the upload; basename() is a second guard.
  return path.join(meshDirectory(), path.basename(storedName));
}

const megabytes = (bytes: number) => `${Number((bytes / (1024 * 1024)).toPrecision(3))} MB`;

function tooLarge(maxBytes: number): ApiError {
  return new ApiError(413, "too_large", `The file is larger than the ${megabytes(maxBytes)} allowed for an STL upload.`, {
    file: `At most ${megabytes(maxBytes)}.`,
  });
}

function badForm(message: string, field = "body"): ApiError {
  return new ApiError(400, "invalid_input", message, { [field]: message });
}

function unitError(value: string | undefined): ApiError {
  const message = value === undefined ? `The unit is missing. ${UNIT_FIELD_HELP}` : `The unit must be "mm" or "in", not "${value.slice(0, 20)}".`;
  return new ApiError(400, "invalid_input", message, { unit: message });
}

const isUnit = (v: string | undefined): v is StlUnit => v === "mm" || v === "in";

/** A file name fit to show: the base name without control characters, at most 200 characters. */
function cleanFileName(raw: string | undefined): string {
  const base = path.basename((raw ?? "").replace(/\\/g, "/")).replace(/[\u0000-\u001f\u007f]/g, "").trim();
  return (base || "upload.stl").slice(0, 200);
}

/**
 * A measurement taken in one unit, re-expressed for a file drawn in another. Scaling every
 * coordinate by k scales lengths by k, areas by k² and volumes by k³ exactly.
 */
export function rescaleMeasurement<T extends Pick<StlMeasurement, "areaM2" | "volumeM3" | "bboxMm">>(m: T, from: StlUnit, to: StlUnit): T {
  if (from === to) return m;
  const k = unitFactors(to).mmPerUnit / unitFactors(from).mmPerUnit;
  return {
    ...m,
    areaM2: m.areaM2 * k * k,
    volumeM3: m.volumeM3 * k * k * k,
    bboxMm: { x: m.bboxMm.x * k, y: m.bboxMm.y * k, z: m.bboxMm.z * k },
  };
}

interface Received {
  fileName: string;
  sizeBytes: number;
  unit: StlUnit;
  measurement: StlMeasurement;
}

/**
 * Streams the multipart body: the "file" part through the measurer into `partPath`; the "unit"
 * field before or after it. Resolves once the whole body is read and the file is written.
 */
async function streamUpload(body: ReadableStream<Uint8Array>, contentType: string, maxBytes: number, partPath: string): Promise<Received> {
  let parser: busboy.Busboy;
  try {
    parser = busboy({
      headers: { "content-type": contentType },
      limits: { files: 1, fileSize: maxBytes, fields: 8, fieldSize: 1024, parts: 12 },
    });
  } catch (e) {
    throw badForm(`The upload is not a multipart form: ${(e as Error).message}.`);
  }
  const source = Readable.fromWeb(body as unknown as NodeWebReadableStream<Uint8Array>);

  let unitText: string | undefined;
  let fileSeen = false;
  let fileName = "";
  let sizeBytes = 0;
  let measuredIn: StlUnit = "mm";
  let measurement: StlMeasurement | null = null;
  let fileDone: Promise<void> | null = null;

  let fail!: (e: unknown) => void;
  const parsed = new Promise<void>((resolve, reject) => {
    fail = reject;
    parser.on("close", resolve);
  });
  // The first failure wins; later ones (streams torn down after it) are ignored.
  parsed.catch(() => undefined);

  parser.on("field", (name, value) => {
    if (name !== "unit") return;
    unitText = value.trim();
    if (!fileSeen && !isUnit(unitText)) fail(unitError(unitText));
  });
  parser.on("file", (name, stream, info) => {
    if (name !== "file" || fileSeen) {
      stream.resume(); // other file fields are read past and dropped
      return;
    }
    fileSeen = true;
    fileName = cleanFileName(info.filename);
    // When the unit came first, measure in it; otherwise in mm, rescaled once the unit arrives.
    measuredIn = isUnit(unitText) ? unitText : "mm";
    const measurer: StlMeasurer = createStlMeasurer({ unit: measuredIn });
    stream.on("limit", () => {
      fail(tooLarge(maxBytes));
      stream.destroy();
    });
    const measure = new Transform({
      transform(chunk: Buffer, _encoding, done) {
        try {
          measurer.push(chunk);
          sizeBytes += chunk.length;
          done(null, chunk);
        } catch (e) {
          done(e as Error);
        }
      },
      flush(done) {
        try {
          measurement = measurer.finish();
          done();
        } catch (e) {
          done(e as Error);
        }
      },
    });
    fileDone = pipeline(stream, measure, createWriteStream(partPath, { flags: "wx" }));
    fileDone.catch((e) => fail(e));
  });
  parser.on("filesLimit", () => fail(badForm("Send one STL file per upload.", "file")));
  parser.on("error", (e) => fail(badForm(`The upload is not a complete multipart form: ${(e as Error).message}.`)));
  source.on("error", (e) => fail(badForm(`The upload was interrupted: ${e.message}.`)));
  source.pipe(parser);

  try {
    await parsed;
    if (fileDone) await fileDone;
  } catch (e) {
    // Stop reading the request, and wait for the file write to stop before anyone deletes it.
    source.unpipe(parser);
    source.destroy();
    parser.destroy();
    if (fileDone) await (fileDone as Promise<void>).catch(() => undefined);
    throw e;
  }
  if (!fileSeen) throw badForm('The file is missing: send it in the form field "file".', "file");
  if (!isUnit(unitText)) throw unitError(unitText);
  if (!measurement) throw new GeometryError("empty_file", "The file is empty.");
  return { fileName, sizeBytes, unit: unitText, measurement: rescaleMeasurement(measurement, measuredIn, unitText) };
}

function toView(row: MeshRow): MeshView {
  const bboxMm = { x: row.bbox_x_mm, y: row.bbox_y_mm, z: row.bbox_z_mm };
  return {
    id: row.id,
    fileName: row.file_name,
    unit: row.unit,
    sizeBytes: row.size_bytes,
    format: row.format,
    triangleCount: row.triangle_count,
    areaM2: row.area_m2,
    volumeM3: row.volume_m3,
    bboxMm,
    closed: row.closed === 1,
    unitHint: suggestUnit(bboxMm, row.unit),
    createdAt: row.created_at,
  };
}

/** POST /api/meshes: measure and store one uploaded STL file. */
export async function receiveMesh(request: Request, userId: string | null): Promise<MeshView> {
  const contentType = request.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data\b/i.test(contentType)) {
    await request.body?.cancel().catch(() => undefined);
    throw badForm('Send the STL as a multipart form with the fields "file" and "unit" ("mm" or "in").');
  }
  const maxBytes = meshMaxBytes();
  const declared = Number(request.headers.get("content-length"));
  if (Number.isFinite(declared) && declared > maxBytes + MULTIPART_SLACK_BYTES) {
    await request.body?.cancel().catch(() => undefined);
    throw tooLarge(maxBytes);
  }
  if (!request.body) throw badForm("The upload is empty: send the STL file in the form field \"file\".", "file");

  const dir = meshDirectory();
  await mkdir(dir, { recursive: true });
  const id = randomUUID();
  const storedName = `${id}.stl`;
  const finalPath = storedPath(storedName);
  // Written under a temporary name: a crash mid-upload never leaves a file that looks complete.
  const partPath = `${finalPath}.part`;
  try {
    const got = await streamUpload(request.body, contentType, maxBytes, partPath);
    await rename(partPath, finalPath);
    const m = got.measurement;
    const row: MeshRow = {
      id,
      file_name: got.fileName,
      stored_name: storedName,
      unit: got.unit,
      size_bytes: got.sizeBytes,
      format: m.format,
      triangle_count: m.triangleCount,
      area_m2: m.areaM2,
      volume_m3: m.volumeM3,
      bbox_x_mm: m.bboxMm.x,
      bbox_y_mm: m.bboxMm.y,
      bbox_z_mm: m.bboxMm.z,
      closed: m.closed ? 1 : 0,
      created_by: userId,
      created_at: Math.floor(Date.now() / 1000),
    };
    try {
      await insertMesh(await getDb(), row);
    } catch (e) {
      await rm(finalPath, { force: true });
      throw e;
    }
    return toView(row);
  } catch (e) {
    await rm(partPath, { force: true });
    throw e;
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

async function meshRow(id: string): Promise<MeshRow> {
  const row = UUID.test(id) ? await findMeshRow(await getDb(), id.toLowerCase()) : undefined;
  if (!row) throw new ApiError(404, "not_found", "No such mesh.");
  return row;
}

export async function getMesh(id: string): Promise<MeshView> {
  return toView(await meshRow(id));
}

/** The mesh's row as the parts service needs it (null when there is no such mesh). */
export async function findMesh(id: string): Promise<MeshView | null> {
  if (!UUID.test(id)) return null;
  const row = await findMeshRow(await getDb(), id.toLowerCase());
  return row ? toView(row) : null;
}

/** The stored STL as a stream for GET /api/meshes/[id]/file. */
export async function meshFile(id: string): Promise<{ stream: ReadableStream<Uint8Array>; sizeBytes: number; fileName: string }> {
  const row = await meshRow(id);
  const file = storedPath(row.stored_name);
  let size: number;
  try {
    size = (await stat(file)).size;
  } catch {
    throw new ApiError(404, "not_found", "The mesh's file is missing from the data folder.");
  }
  const stream = Readable.toWeb(createReadStream(file)) as unknown as ReadableStream<Uint8Array>;
  return { stream, sizeBytes: size, fileName: row.file_name };
}

/**
 * The unit chosen again after the upload (the size looked wrong). Every number is rescaled
 * exactly; refused while a part uses the mesh, since the part's area came from the old unit.
 */
export async function changeMeshUnit(id: string, unit: StlUnit): Promise<MeshView> {
  const row = await meshRow(id);
  const db = await getDb();
  const users = await partNumbersUsingMesh(db, row.id);
  if (users.length) {
    throw new ApiError(
      409,
      "conflict",
      `Part${users.length === 1 ? "" : "s"} ${users.join(", ")} already use${users.length === 1 ? "s" : ""} this mesh; upload the file again with the other unit instead.`,
    );
  }
  const view = toView(row);
  const m = rescaleMeasurement(view, row.unit, unit);
  await updateMesh(db, row.id, {
    unit,
    area_m2: m.areaM2,
    volume_m3: m.volumeM3,
    bbox_x_mm: m.bboxMm.x,
    bbox_y_mm: m.bboxMm.y,
    bbox_z_mm: m.bboxMm.z,
  });
  return getMesh(row.id);
}

const HOUR_S = 3600;
const DEFAULT_UNATTACHED_DAYS = 7;

/** Days an uploaded mesh may stay unused by any part before the sweep deletes it (MESH_UNATTACHED_DAYS). */
export function meshUnattachedDays(): number {
  const raw = Number(process.env.MESH_UNATTACHED_DAYS);
  return Number.isFinite(raw) && raw > 0 ? raw : DEFAULT_UNATTACHED_DAYS;
}

export interface MeshSweepReport {
  /** ".part" files of uploads that never finished (a crash or a killed server) */
  partialFiles: number;
  /** files no mesh row names (a crash between the rename and the insert) */
  strayFiles: number;
  /** mesh rows (and their files) no part has used since they were uploaded */
  unattachedMeshes: number;
}

/**
 * Tidies the mesh folder: partial uploads, files without a row, and meshes uploaded but never
 * attached to a part. Files younger than an hour are left alone, so an upload in progress (or
 * one between its rename and its insert) is never touched. Runs at start-up.
 */
export async function sweepMeshFolder(nowS = Math.floor(Date.now() / 1000)): Promise<MeshSweepReport> {
  const report: MeshSweepReport = { partialFiles: 0, strayFiles: 0, unattachedMeshes: 0 };
  const db = await getDb();
  const dir = meshDirectory();
  for (const name of await deleteUnattachedMeshes(db, nowS - meshUnattachedDays() * 24 * HOUR_S)) {
    await rm(storedPath(name), { force: true });
    report.unattachedMeshes++;
  }
  let names: string[];
  try {
    names = await readdir(dir);
  } catch {
    return report; // no folder yet: nothing was ever uploaded
  }
  const known = await storedMeshNames(db);
  for (const name of names) {
    const partial = name.endsWith(".stl.part");
    if (!partial && (!name.endsWith(".stl") || known.has(name))) continue;
    const file = path.join(dir, name);
    const info = await stat(file).catch(() => null);
    if (!info?.isFile() || info.mtimeMs / 1000 > nowS - HOUR_S) continue;
    await rm(file, { force: true });
    if (partial) report.partialFiles++;
    else report.strayFiles++;
  }
  return report;
}
