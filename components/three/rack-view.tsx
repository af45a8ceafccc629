"use client";
// The 3D rack view: the carrier window as lines, the planned parts instanced (one draw call per
// geometry), orbit/zoom, preset views, the clearance envelopes on demand, hover for a part's
// number and position, and a count / load / fill summary. Load it through rack-view-lazy.tsx so
// three.js is only fetched on pages that show 3D.

import { Component, useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactNode } from "react";
import { Canvas, useFrame, useThree, type ThreeEvent } from "@react-three/fiber";
import { OrbitControls } from "@react-three/drei";
import type { OrbitControls as OrbitControlsImpl } from "three-stdlib";
import * as THREE from "three";
import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import {
  fillSummary,
  frameLineGeometry,
  groupBySize,
  instanceMatrices,
  MESH_TRIANGLE_BUDGET,
  orientedGeometry,
  toGeometry,
  triangleCount,
  unitBoxGeometry,
  viewCamera,
  type PlacementGroup,
  type PlacementMm,
  type ViewName,
  type WindowSizeMm,
} from "./rack-geometry";
import { RackSummary } from "./rack-summary";

export interface RackViewProps {
  windowMm: WindowSizeMm;
  /** The plan's placements (minMm, sizeMm), one per part counted. */
  placements: readonly PlacementMm[];
  clearanceMm: number;
  partMassKg: number;
  maxLoadKg: number;
  unitSystem: UnitSystem;
  /** Parts that fit by space before the load limit (shown when the load decides). */
  spaceCount?: number;
  /**
   * The part's mesh in its own frame (mm; CAD x → length, y → width, z → height), as geometry or
   * raw non-indexed positions. It is turned into each placement's size; without it, boxes.
   */
  partMesh?: THREE.BufferGeometry | Float32Array | null;
}

const FOV_DEG = 35;
const GROUP_COLOURS = ["#2f7f76", "#b07c1a", "#5b6f8a", "#8a4f7d", "#4f7d3a", "#a8461f"];
const FRAME_COLOUR = "#1e262d";
const ENVELOPE_COLOUR = "#1d6b63";
const HOVER_COLOUR = "#d94f00";

interface Hover {
  index: number;
}

/** Colours per instance: one hue per orientation, every other part a shade lighter. */
function instanceColours(placements: readonly PlacementMm[], indices: readonly number[], hue: string, clearanceMm: number): Float32Array {
  const base = new THREE.Color(hue);
  const light = base.clone().lerp(new THREE.Color("#ffffff"), 0.22);
  const out = new Float32Array(indices.length * 3);
  indices.forEach((index, k) => {
    const { minMm, sizeMm } = placements[index];
    let cell = 0;
    for (let a = 0; a < 3; a++) cell += Math.round(minMm[a] / (sizeMm[a] + clearanceMm));
    const c = cell % 2 === 0 ? base : light;
    out.set([c.r, c.g, c.b], k * 3);
  });
  return out;
}

function PartInstances(props: {
  geometry: THREE.BufferGeometry;
  matrices: Float32Array;
  colours: Float32Array;
  indices: readonly number[];
  onHover: (hover: Hover | null) => void;
  doubleSided: boolean;
}) {
  const { geometry, matrices, colours, indices, onHover, doubleSided } = props;
  const ref = useRef<THREE.InstancedMesh>(null);
  const invalidate = useThree((s) => s.invalidate);
  const count = indices.length;
  useLayoutEffect(() => {
    const mesh = ref.current;
    if (!mesh) return;
    mesh.instanceMatrix.array.set(matrices);
    mesh.instanceMatrix.needsUpdate = true;
    mesh.instanceColor = new THREE.InstancedBufferAttribute(colours, 3);
    mesh.computeBoundingBox();
    mesh.computeBoundingSphere();
    invalidate();
  }, [matrices, colours, invalidate]);
  return (
    <instancedMesh
      ref={ref}
      args={[geometry, undefined, count]}
      onPointerMove={(e: ThreeEvent<PointerEvent>) => {
        e.stopPropagation();
        if (e.instanceId !== undefined) onHover({ index: indices[e.instanceId] });
      }}
      onPointerOut={() => onHover(null)}
    >
      <meshLambertMaterial side={doubleSided ? THREE.DoubleSide : THREE.FrontSide} />
    </instancedMesh>
  );
}

/** Each part's clearance envelope: its box grown by half the clearance on every side, so the
 *  envelopes of neighbours at exactly the clearance just touch. Not pickable. */
function Envelopes({ placements, clearanceMm }: { placements: readonly PlacementMm[]; clearanceMm: number }) {
  const ref = useRef<THREE.InstancedMesh>(null);
  const invalidate = useThree((s) => s.invalidate);
  const geometry = useMemo(() => unitBoxGeometry(), []);
  const indices = useMemo(() => placements.map((_, i) => i), [placements]);
  const matrices = useMemo(
    () => instanceMatrices(placements, indices, { scaleToSize: true, growMm: clearanceMm / 2 }),
    [placements, indices, clearanceMm],
  );
  useLayoutEffect(() => {
    const mesh = ref.current;
    if (!mesh) return;
    mesh.instanceMatrix.array.set(matrices);
    mesh.instanceMatrix.needsUpdate = true;
    mesh.computeBoundingSphere();
    invalidate();
  }, [matrices, invalidate]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  return (
    <instancedMesh ref={ref} args={[geometry, undefined, placements.length]} raycast={() => null} renderOrder={2}>
      <meshBasicMaterial color={ENVELOPE_COLOUR} transparent opacity={0.14} depthWrite={false} />
    </instancedMesh>
  );
}

function HoverBox({ placement }: { placement: PlacementMm }) {
  const edges = useMemo(() => new THREE.EdgesGeometry(unitBoxGeometry()), []);
  useEffect(() => () => edges.dispose(), [edges]);
  return (
    <lineSegments geometry={edges} position={placement.minMm} scale={placement.sizeMm} raycast={() => null}>
      <lineBasicMaterial color={HOVER_COLOUR} />
    </lineSegments>
  );
}

function Frame({ windowMm }: { windowMm: WindowSizeMm }) {
  const geometry = useMemo(
    () => frameLineGeometry(windowMm),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [windowMm.widthMm, windowMm.heightMm, windowMm.depthMm],
  );
  useEffect(() => () => geometry.dispose(), [geometry]);
  return (
    <lineSegments geometry={geometry} raycast={() => null}>
      <lineBasicMaterial color={FRAME_COLOUR} />
    </lineSegments>
  );
}

/**
 * Renders each frame itself (a positive priority turns off R3F's own render) so the draw calls
 * read right after are this frame's, and reports them.
 */
function RenderAndCount({ onCalls }: { onCalls: (calls: number) => void }) {
  useFrame(({ gl, scene, camera }) => {
    gl.render(scene, camera);
    onCalls(gl.info.render.calls);
  }, 1);
  return null;
}

interface ViewCommand {
  view: ViewName;
  nonce: number;
}

interface ZoomCommand {
  factor: number;
  nonce: number;
}

function CameraRig({ windowMm, view, zoom }: { windowMm: WindowSizeMm; view: ViewCommand; zoom: ZoomCommand }) {
  const camera = useThree((s) => s.camera) as THREE.PerspectiveCamera;
  const controls = useThree((s) => s.controls) as OrbitControlsImpl | null;
  const invalidate = useThree((s) => s.invalidate);
  const { widthMm, heightMm, depthMm } = windowMm;

  useEffect(() => {
    const w = { widthMm, heightMm, depthMm };
    const { position, target } = viewCamera(w, view.view, FOV_DEG);
    const largest = Math.max(widthMm, heightMm, depthMm);
    camera.position.set(...position);
    camera.near = largest / 500;
    camera.far = largest * 50;
    camera.updateProjectionMatrix();
    if (controls) {
      controls.target.set(...target);
      controls.minDistance = largest / 50;
      controls.maxDistance = largest * 20;
      controls.update();
    } else {
      camera.lookAt(...target);
    }
    invalidate();
  }, [camera, controls, invalidate, view, widthMm, heightMm, depthMm]);

  useEffect(() => {
    if (zoom.nonce === 0 || !controls) return;
    const offset = camera.position.clone().sub(controls.target).multiplyScalar(zoom.factor);
    camera.position.copy(controls.target).add(offset);
    controls.update();
    invalidate();
  }, [camera, controls, invalidate, zoom]);
  return null;
}

class WebGlBoundary extends Component<{ children: ReactNode }, { failed: boolean }> {
  state = { failed: false };
  static getDerivedStateFromError() {
    return { failed: true };
  }
  render() {
    if (this.state.failed) {
      return (
        <p className="p-4 text-sm text-ink-soft">
          This browser could not start 3D drawing (WebGL). The plan and the list below are unaffected.
        </p>
      );
    }
    return this.props.children;
  }
}

export function RackView(props: RackViewProps) {
  const { windowMm, placements, clearanceMm, partMassKg, maxLoadKg, unitSystem, spaceCount, partMesh } = props;
  const wrapper = useRef<HTMLDivElement>(null);
  const [showClearance, setShowClearance] = useState(false);
  const [hover, setHover] = useState<Hover | null>(null);
  const [view, setView] = useState<ViewCommand>({ view: "iso", nonce: 0 });
  const [zoom, setZoom] = useState<ZoomCommand>({ factor: 1, nonce: 0 });

  const groups: PlacementGroup[] = useMemo(() => groupBySize(placements), [placements]);
  const trianglesPerPart = partMesh ? triangleCount(partMesh) : 12;
  const meshTriangles = placements.length * trianglesPerPart;
  const overBudget = Boolean(partMesh) && meshTriangles > MESH_TRIANGLE_BUDGET;
  const drawMesh = Boolean(partMesh) && !overBudget;

  // Boxes: one unit box for every orientation (scaled per instance) → one draw call in all.
  // Mesh: one turned copy of the mesh per orientation → one draw call per orientation.
  const box = useMemo(() => unitBoxGeometry(), []);
  const meshGeometries = useMemo(() => {
    if (!drawMesh || !partMesh) return null;
    const source = toGeometry(partMesh);
    return groups.map((g) => orientedGeometry(source, g.sizeMm));
  }, [drawMesh, partMesh, groups]);
  useEffect(() => () => box.dispose(), [box]);
  useEffect(() => () => meshGeometries?.forEach((g) => g.dispose()), [meshGeometries]);

  const batches = useMemo(() => {
    if (meshGeometries) {
      return groups.map((g, i) => ({
        key: `mesh-${i}-${g.indices.length}`,
        geometry: meshGeometries[i],
        indices: g.indices,
        matrices: instanceMatrices(placements, g.indices, { scaleToSize: false }),
        colours: instanceColours(placements, g.indices, GROUP_COLOURS[i % GROUP_COLOURS.length], clearanceMm),
      }));
    }
    if (placements.length === 0) return [];
    const all = placements.map((_, i) => i);
    const colours = new Float32Array(placements.length * 3);
    groups.forEach((g, i) => {
      const c = instanceColours(placements, g.indices, GROUP_COLOURS[i % GROUP_COLOURS.length], clearanceMm);
      g.indices.forEach((index, k) => colours.set(c.subarray(k * 3, k * 3 + 3), index * 3));
    });
    return [
      {
        key: `boxes-${placements.length}`,
        geometry: box,
        indices: all,
        matrices: instanceMatrices(placements, all, { scaleToSize: true }),
        colours,
      },
    ];
  }, [meshGeometries, groups, placements, clearanceMm, box]);

  const onHover = useCallback((h: Hover | null) => {
    setHover((old) => (old?.index === h?.index ? old : h));
  }, []);
  const hovered = hover && hover.index < placements.length ? placements[hover.index] : null;

  const onCalls = useCallback((calls: number) => {
    const el = wrapper.current;
    if (el && el.dataset.drawCalls !== String(calls)) el.dataset.drawCalls = String(calls);
  }, []);

  const summary = fillSummary(placements, partMassKg, windowMm);
  const initial = viewCamera(windowMm, "iso", FOV_DEG);
  const len = (mm: number) => formatQuantity("lengthMm", mm, unitSystem, 4);
  const viewButtons: { view: ViewName; label: string }[] = [
    { view: "front", label: "Front" },
    { view: "side", label: "Side" },
    { view: "top", label: "Top" },
    { view: "iso", label: "3/4 view" },
  ];

  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_17rem]">
      <div>
        <div className="no-print mb-2 flex flex-wrap items-center gap-2" role="toolbar" aria-label="3D view controls">
          {viewButtons.map((b) => (
            <button key={b.view} type="button" className="btn-quiet" onClick={() => setView((v) => ({ view: b.view, nonce: v.nonce + 1 }))}>
              {b.label}
            </button>
          ))}
          <button type="button" className="btn-quiet" aria-label="Zoom in" onClick={() => setZoom((z) => ({ factor: 0.8, nonce: z.nonce + 1 }))}>
            +
          </button>
          <button type="button" className="btn-quiet" aria-label="Zoom out" onClick={() => setZoom((z) => ({ factor: 1.25, nonce: z.nonce + 1 }))}>
            −
          </button>
          <label className="ml-2 flex items-center gap-1.5 text-sm">
            <input type="checkbox" checked={showClearance} onChange={(e) => setShowClearance(e.target.checked)} disabled={clearanceMm <= 0} />
            Show clearance{clearanceMm <= 0 ? " (none set)" : ""}
          </label>
        </div>
        <div
          ref={wrapper}
          data-testid="rack-view"
          data-draw-calls="0"
          data-parts={placements.length}
          className="relative h-[26rem] overflow-hidden rounded-lg border border-plate-line bg-white"
          role="group"
          aria-label={`3D view of ${placements.length} parts in the carrier window; drag to turn, scroll to zoom.`}
        >
          <WebGlBoundary>
            <Canvas
              frameloop="demand"
              dpr={[1, 2]}
              gl={{ antialias: true, preserveDrawingBuffer: true }}
              camera={{ fov: FOV_DEG, near: 1, far: 1e7, position: initial.position }}
            >
              <color attach="background" args={["#ffffff"]} />
              <ambientLight intensity={1.1} />
              <directionalLight position={[-0.4, 1, -0.6]} intensity={1.6} />
              <directionalLight position={[0.6, 0.3, 0.8]} intensity={0.5} />
              <Frame windowMm={windowMm} />
              {batches.map((b) => (
                <PartInstances
                  key={b.key}
                  geometry={b.geometry}
                  matrices={b.matrices}
                  colours={b.colours}
                  indices={b.indices}
                  onHover={onHover}
                  doubleSided={drawMesh}
                />
              ))}
              {showClearance && clearanceMm > 0 && placements.length > 0 && (
                <Envelopes placements={placements} clearanceMm={clearanceMm} />
              )}
              {hovered && <HoverBox placement={hovered} />}
              <OrbitControls makeDefault enableDamping={false} />
              <CameraRig windowMm={windowMm} view={view} zoom={zoom} />
              <RenderAndCount onCalls={onCalls} />
            </Canvas>
          </WebGlBoundary>
          <p className="pointer-events-none absolute bottom-2 left-2 rounded bg-white/85 px-2 py-1 text-xs text-ink-soft" aria-live="polite">
            {showClearance && clearanceMm > 0 && !hovered
              ? `Shaded around each part: its clearance envelope, ${len(clearanceMm / 2)} (half the clearance) on every side, so neighbours' envelopes just touch. `
              : ""}
            {hovered
              ? `Part ${hover!.index + 1} of ${placements.length}: corner at x ${len(hovered.minMm[0])}, y ${len(hovered.minMm[1])}, z ${len(hovered.minMm[2])}; ${hovered.sizeMm.map(len).join(" × ")}`
              : "Point at a part for its number and position. The arrow under the window is the direction of travel (x)."}
          </p>
        </div>
      </div>
      <RackSummary
        count={summary.count}
        spaceCount={spaceCount}
        totalKg={summary.totalKg}
        maxLoadKg={maxLoadKg}
        fillPercent={summary.fillPercent}
        unitSystem={unitSystem}
        drawnAs={drawMesh ? "mesh" : "boxes"}
        trianglesPerPart={partMesh ? trianglesPerPart : null}
        overBudget={overBudget}
        meshTriangles={meshTriangles}
        budgetTriangles={MESH_TRIANGLE_BUDGET}
      />
    </div>
  );
}
