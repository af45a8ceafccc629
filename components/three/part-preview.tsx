"use client";
// A part's mesh in 3D: fetched from /api/meshes/{id}/file, turned Z-up (CAD) to Y-up (three.js),
// drawn with its bounding box and the box's sizes in the user's units; orbit and zoom. Load it
// through part-preview-lazy.tsx so three.js is fetched only where 3D is shown.

import { Component, useEffect, useMemo, useRef, useState, type ReactNode, type RefObject } from "react";
import { Canvas, useFrame, useThree } from "@react-three/fiber";
import { OrbitControls } from "@react-three/drei";
import * as THREE from "three";
import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import { loadPartMesh } from "@/components/parts/load-part-mesh";

export interface PartPreviewProps {
  meshId: string;
  /** the unit the file was drawn in */
  unit: "mm" | "in";
  unitSystem: UnitSystem;
  /** the measured box (x → length, y → width, z → height), mm */
  bboxMm: { x: number; y: number; z: number };
  sizeBytes: number;
  triangleCount: number;
}

/** Above this the preview waits for a click: software WebGL and phones stall on huge meshes. */
const AUTO_LOAD_BYTES = 40 * 1024 * 1024;
const FOV_DEG = 35;

type Loaded = { status: "loading" } | { status: "ready"; geometry: THREE.BufferGeometry; size: THREE.Vector3 } | { status: "error"; message: string };

/** Positions in the file's Z-up frame → a centred Y-up geometry standing on y = 0. */
function sceneGeometry(positions: Float32Array): { geometry: THREE.BufferGeometry; size: THREE.Vector3 } {
  const geometry = new THREE.BufferGeometry();
  geometry.setAttribute("position", new THREE.BufferAttribute(positions, 3));
  // CAD z (height) becomes three.js y (up); CAD y (width) comes toward the viewer.
  geometry.rotateX(-Math.PI / 2);
  geometry.computeBoundingBox();
  const box = geometry.boundingBox!;
  const centre = box.getCenter(new THREE.Vector3());
  geometry.translate(-centre.x, -box.min.y, -centre.z);
  geometry.computeVertexNormals();
  geometry.computeBoundingBox();
  geometry.computeBoundingSphere();
  return { geometry, size: box.getSize(new THREE.Vector3()) };
}

function Camera({ size, nonce, zoom }: { size: THREE.Vector3; nonce: number; zoom: { factor: number; nonce: number } }) {
  const camera = useThree((s) => s.camera) as THREE.PerspectiveCamera;
  const controls = useThree((s) => s.controls) as unknown as { target: THREE.Vector3; update(): void; minDistance: number; maxDistance: number } | null;
  const invalidate = useThree((s) => s.invalidate);
  useEffect(() => {
    const radius = Math.max(size.length() / 2, 1);
    const distance = (radius / Math.sin(((FOV_DEG / 2) * Math.PI) / 180)) * 1.15;
    const target = new THREE.Vector3(0, size.y / 2, 0);
    const direction = new THREE.Vector3(1, 0.7, 1.3).normalize();
    camera.position.copy(target).addScaledVector(direction, distance);
    camera.near = radius / 200;
    camera.far = radius * 100;
    camera.updateProjectionMatrix();
    if (controls) {
      controls.target.copy(target);
      controls.minDistance = radius / 20;
      controls.maxDistance = radius * 20;
      controls.update();
    } else {
      camera.lookAt(target);
    }
    invalidate();
  }, [camera, controls, invalidate, size, nonce]);
  useEffect(() => {
    if (zoom.nonce === 0 || !controls) return;
    const offset = camera.position.clone().sub(controls.target).multiplyScalar(zoom.factor);
    camera.position.copy(controls.target).add(offset);
    controls.update();
    invalidate();
  }, [camera, controls, invalidate, zoom]);
  return null;
}

function BoundingBox({ size }: { size: THREE.Vector3 }) {
  const edges = useMemo(() => {
    const box = new THREE.BoxGeometry(size.x, size.y, size.z);
    box.translate(0, size.y / 2, 0);
    const e = new THREE.EdgesGeometry(box);
    box.dispose();
    return e;
  }, [size]);
  useEffect(() => () => edges.dispose(), [edges]);
  return (
    <lineSegments geometry={edges}>
      <lineBasicMaterial color="#a8461f" />
    </lineSegments>
  );
}

/** Where the size labels sit: the front-lower edge (length), the right-lower edge (width), a vertical edge (height). */
function labelPoints(size: THREE.Vector3): THREE.Vector3[] {
  return [new THREE.Vector3(0, 0, size.z / 2), new THREE.Vector3(size.x / 2, 0, 0), new THREE.Vector3(-size.x / 2, size.y / 2, size.z / 2)];
}

/** Moves the HTML labels over their 3D points on every drawn frame (no React render per frame). */
function LabelTracker({ points, labels }: { points: THREE.Vector3[]; labels: RefObject<(HTMLSpanElement | null)[]> }) {
  const v = useMemo(() => new THREE.Vector3(), []);
  useFrame(({ camera, size }) => {
    points.forEach((p, i) => {
      const el = labels.current?.[i];
      if (!el) return;
      v.copy(p).project(camera);
      const visible = v.z > -1 && v.z < 1;
      el.style.display = visible ? "" : "none";
      el.style.transform = `translate(${((v.x + 1) / 2) * size.width}px, ${((1 - v.y) / 2) * size.height}px) translate(-50%, -50%)`;
    });
  });
  return null;
}

class WebGlBoundary extends Component<{ children: ReactNode }, { failed: boolean }> {
  state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  render() {
    if (this.state.failed) {
      return <p className="p-4 text-sm text-ink-soft">This browser could not start 3D drawing (WebGL). The measured numbers are unaffected.</p>;
    }
    return this.props.children;
  }
}

export function PartPreview({ meshId, unit, unitSystem, bboxMm, sizeBytes, triangleCount }: PartPreviewProps) {
  const [allowed, setAllowed] = useState(sizeBytes <= AUTO_LOAD_BYTES);
  const [loaded, setLoaded] = useState<Loaded>({ status: "loading" });
  const [viewNonce, setViewNonce] = useState(0);
  const [zoom, setZoom] = useState({ factor: 1, nonce: 0 });
  const labelRefs = useRef<(HTMLSpanElement | null)[]>([]);

  useEffect(() => {
    if (!allowed) return;
    const abort = new AbortController();
    setLoaded({ status: "loading" });
    loadPartMesh(meshId, unit, abort.signal)
      .then((positions) => setLoaded({ status: "ready", ...sceneGeometry(positions) }))
      .catch((e: Error) => {
        if (!abort.signal.aborted) setLoaded({ status: "error", message: e.message });
      });
    return () => abort.abort();
  }, [meshId, unit, allowed]);
  useEffect(() => () => (loaded.status === "ready" ? loaded.geometry.dispose() : undefined), [loaded]);

  const len = (mm: number) => formatQuantity("lengthMm", mm, unitSystem, 4);
  const labels = { length: len(bboxMm.x), width: len(bboxMm.y), height: len(bboxMm.z) };

  return (
    <figure className="space-y-2">
      <div className="flex flex-wrap items-center gap-2" role="toolbar" aria-label="3D preview controls">
        <button type="button" className="btn-quiet" onClick={() => setViewNonce((n) => n + 1)} disabled={loaded.status !== "ready"}>
          Reset view
        </button>
        <button type="button" className="btn-quiet" aria-label="Zoom in" onClick={() => setZoom((z) => ({ factor: 0.8, nonce: z.nonce + 1 }))} disabled={loaded.status !== "ready"}>
          +
        </button>
        <button type="button" className="btn-quiet" aria-label="Zoom out" onClick={() => setZoom((z) => ({ factor: 1.25, nonce: z.nonce + 1 }))} disabled={loaded.status !== "ready"}>
          −
        </button>
        <span className="text-xs text-ink-faint">Drag to turn, scroll to zoom.</span>
      </div>
      <div
        data-testid="part-preview"
        data-state={allowed ? loaded.status : "waiting"}
        className="relative h-80 overflow-hidden rounded-lg border border-plate-line bg-white"
        role="img"
        aria-label={`3D view of the part: ${labels.length} long, ${labels.width} wide, ${labels.height} high.`}
      >
        {!allowed ? (
          <div className="flex h-full flex-col items-center justify-center gap-2 p-4 text-center text-sm text-ink-soft">
            <p>
              This mesh has {triangleCount.toLocaleString("en-US")} triangles ({Math.round(sizeBytes / (1024 * 1024))} MB); drawing it may be slow on this computer.
            </p>
            <button type="button" className="btn-quiet" onClick={() => setAllowed(true)}>Show the 3D preview</button>
          </div>
        ) : loaded.status === "loading" ? (
          <p role="status" className="flex h-full items-center justify-center text-sm text-ink-faint">Loading the mesh…</p>
        ) : loaded.status === "error" ? (
          <p role="alert" className="flex h-full items-center justify-center p-4 text-sm text-oxide">{loaded.message}</p>
        ) : (
          <WebGlBoundary>
            <Canvas frameloop="demand" dpr={[1, 2]} gl={{ antialias: true, preserveDrawingBuffer: true }} camera={{ fov: FOV_DEG, near: 1, far: 1e7 }}>
              <color attach="background" args={["#ffffff"]} />
              <ambientLight intensity={1.0} />
              <directionalLight position={[0.5, 1, 0.8]} intensity={1.8} />
              <directionalLight position={[-0.8, 0.4, -0.6]} intensity={0.6} />
              <mesh geometry={loaded.geometry}>
                <meshStandardMaterial color="#2f7f76" metalness={0.15} roughness={0.55} side={THREE.DoubleSide} />
              </mesh>
              <BoundingBox size={loaded.size} />
              <LabelTracker points={labelPoints(loaded.size)} labels={labelRefs} />
              <gridHelper args={[Math.max(loaded.size.x, loaded.size.z) * 1.6, 10, "#d3d6cf", "#e8e9e3"]} />
              <OrbitControls makeDefault enableDamping={false} />
              <Camera size={loaded.size} nonce={viewNonce} zoom={zoom} />
            </Canvas>
          </WebGlBoundary>
        )}
        {allowed && loaded.status === "ready" &&
          [`L ${labels.length}`, `W ${labels.width}`, `H ${labels.height}`].map((text, i) => (
            <span
              key={text}
              ref={(el) => {
                labelRefs.current[i] = el;
              }}
              aria-hidden
              className="pointer-events-none absolute left-0 top-0 whitespace-nowrap rounded bg-white/90 px-1.5 py-0.5 text-xs font-medium text-ink shadow-sm"
              style={{ display: "none" }}
            >
              {text}
            </span>
          ))}
      </div>
      <figcaption className="num text-sm text-ink-soft">
        Bounding box: length (x) {labels.length} · width (y) {labels.width} · height (z, up) {labels.height}
      </figcaption>
    </figure>
  );
}
