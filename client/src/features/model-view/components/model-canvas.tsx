import { useEffect, useMemo, useReducer, useRef } from 'react';
import { Canvas, useThree } from '@react-three/fiber';
import { OrbitControls } from '@react-three/drei';
import * as THREE from 'three';
import { LineSegments2 } from 'three/examples/jsm/lines/LineSegments2.js';
import { LineSegmentsGeometry } from 'three/examples/jsm/lines/LineSegmentsGeometry.js';
import { LineMaterial } from 'three/examples/jsm/lines/LineMaterial.js';
import { IndexLayer } from '../scene/index-layer';
import type { SceneModel } from '../scene/scene-model';
import { CONTEXT_STYLE, NOT_CHECKED_STYLE } from '../scene/member-look';
import { cameraPose, type ViewName } from '../scene/views';

export const CANVAS_BACKGROUND = '#C9C5BC';
const OVER_EDGE = '#1C2430';
const SELECTED_EDGE = '#FFFFFF';
const HOVER_EDGE = '#1C2430';

export type CameraRequest = { nonce: number } & ({ kind: 'view'; view: ViewName; box: THREE.Box3 } | { kind: 'fit'; box: THREE.Box3 } | { kind: 'orbit'; yaw: number; pitch: number } | { kind: 'zoom'; factor: number });

export interface ModelCanvasProps {
  model: SceneModel;
  /** Bumped whenever the colour attribute was repainted. */
  paintVersion: number;
  main: readonly number[];
  ghost: readonly number[];
  context: readonly number[];
  over: readonly number[];
  selected: readonly number[];
  hover: number | null;
  clip: THREE.Plane | null;
  camera: CameraRequest | null;
  pickable: (entry: number) => boolean;
  onHover(entry: number | null, x: number, y: number): void;
  onPick(entry: number | null, additive: boolean): void;
  /** Called once, after the first frame drawn with result colours. */
  coloured: boolean;
  onFirstColouredFrame(drawCalls: number): void;
}

/** The 3D canvas: renders on demand; a few merged layers, whatever the number of members. */
export function ModelCanvas(props: ModelCanvasProps) {
  const size = props.model.bounds.getSize(new THREE.Vector3()).length() || 10;
  return (
    <Canvas
      flat
      frameloop="demand"
      dpr={[1, 2]}
      gl={{ antialias: true, preserveDrawingBuffer: true }}
      camera={{ fov: 35, near: size / 2000, far: size * 40, position: [size, size * 0.7, size] }}
      onCreated={({ gl }) => {
        gl.localClippingEnabled = true;
      }}
      aria-hidden="true"
    >
      <color attach="background" args={[CANVAS_BACKGROUND]} />
      <ambientLight intensity={0.78 * Math.PI} />
      <directionalLight position={[0.5, 1, 0.35]} intensity={0.32 * Math.PI} />
      <directionalLight position={[-0.6, 0.2, -0.8]} intensity={0.12 * Math.PI} />
      <Layers {...props} />
      <AxisLines model={props.model} entries={props.main} paintVersion={props.paintVersion} clip={props.clip} width={2.5} renderOrder={5} />
      <AxisLines model={props.model} entries={props.over} paintVersion={props.paintVersion} clip={props.clip} width={7.5} colour={OVER_EDGE} renderOrder={4} />
      <AxisLines model={props.model} entries={props.over} paintVersion={props.paintVersion} clip={props.clip} width={3.5} renderOrder={6} />
      <OrbitControls makeDefault enableDamping={false} />
      <CameraDriver request={props.camera} />
      <Picker pickable={props.pickable} model={props.model} clip={props.clip} onHover={props.onHover} onPick={props.onPick} />
      <FrameProbe coloured={props.coloured} onFirstColouredFrame={props.onFirstColouredFrame} />
    </Canvas>
  );
}

function Layers({ model, paintVersion, main, ghost, context, over, selected, hover, clip }: ModelCanvasProps) {
  const invalidate = useThree((s) => s.invalidate);
  const steel = useMemo(() => model.entries.map((e, i) => (e.context ? -1 : i)).filter((i) => i >= 0), [model]);
  const contextAll = useMemo(() => model.entries.map((e, i) => (e.context ? i : -1)).filter((i) => i >= 0), [model]);
  const layers = useMemo(
    () => ({ main: new IndexLayer(model, steel, true), ghost: new IndexLayer(model, steel, false), context: new IndexLayer(model, contextAll, false) }),
    [model, steel, contextAll],
  );
  useEffect(() => () => Object.values(layers).forEach((l) => l.dispose()), [layers]);

  const planes = useMemo(() => (clip ? [clip] : []), [clip]);
  const materials = useMemo(
    () => ({
      main: new THREE.MeshLambertMaterial({ vertexColors: true, flatShading: true, side: THREE.DoubleSide, polygonOffset: true, polygonOffsetFactor: 1, polygonOffsetUnits: 1 }),
      ghost: new THREE.MeshLambertMaterial({ color: NOT_CHECKED_STYLE.colour, flatShading: true, transparent: true, opacity: 0.3, depthWrite: false, side: THREE.DoubleSide }),
      context: new THREE.MeshLambertMaterial({ color: CONTEXT_STYLE.colour, flatShading: true, transparent: true, opacity: 0.14, depthWrite: false, side: THREE.DoubleSide }),
      over: new THREE.LineBasicMaterial({ color: OVER_EDGE }),
      selected: new THREE.LineBasicMaterial({ color: SELECTED_EDGE, depthTest: false, transparent: true, opacity: 0.95 }),
      hover: new THREE.LineBasicMaterial({ color: HOVER_EDGE }),
    }),
    [],
  );
  useEffect(() => () => Object.values(materials).forEach((m) => m.dispose()), [materials]);
  useEffect(() => {
    for (const m of Object.values(materials)) m.clippingPlanes = planes;
    invalidate();
  }, [materials, planes, invalidate]);

  useEffect(() => {
    layers.main.show(main);
    invalidate();
  }, [layers, main, invalidate]);
  useEffect(() => {
    layers.ghost.show(ghost);
    invalidate();
  }, [layers, ghost, invalidate]);
  useEffect(() => {
    layers.context.show(context);
    invalidate();
  }, [layers, context, invalidate]);
  useEffect(() => invalidate(), [paintVersion, invalidate]);

  const overEdges = useEdges(model, over, true);
  const selectedEdges = useEdges(model, selected, false);
  const hoverList = useMemo(() => (hover === null ? [] : [hover]), [hover]);
  const hoverEdges = useEdges(model, hoverList, false);

  const noRaycast = () => undefined;
  return (
    <>
      <mesh geometry={layers.main.geometry} material={materials.main} raycast={noRaycast} frustumCulled={false} />
      <mesh geometry={layers.ghost.geometry} material={materials.ghost} raycast={noRaycast} frustumCulled={false} renderOrder={1} />
      <mesh geometry={layers.context.geometry} material={materials.context} raycast={noRaycast} frustumCulled={false} renderOrder={2} />
      {overEdges && <lineSegments geometry={overEdges} material={materials.over} raycast={noRaycast} frustumCulled={false} />}
      {hoverEdges && <lineSegments geometry={hoverEdges} material={materials.hover} raycast={noRaycast} frustumCulled={false} renderOrder={3} />}
      {selectedEdges && <lineSegments geometry={selectedEdges} material={materials.selected} raycast={noRaycast} frustumCulled={false} renderOrder={4} />}
    </>
  );
}

/**
 * Slender members drawn along their axes as lines a few pixels wide, in their band colour
 * (or one colour): inside the solid when it is big on screen, the only visible trace when it is
 * thinner than a pixel. One draw call for all of them.
 */
function AxisLines({ model, entries, paintVersion, clip, width, colour, renderOrder }: { model: SceneModel; entries: readonly number[]; paintVersion: number; clip: THREE.Plane | null; width: number; colour?: string; renderOrder: number }) {
  const invalidate = useThree((s) => s.invalidate);
  const object = useMemo(() => {
    const material = new LineMaterial({ linewidth: width, vertexColors: !colour, color: colour ?? '#ffffff', worldUnits: false });
    const line = new LineSegments2(new LineSegmentsGeometry(), material);
    line.renderOrder = renderOrder;
    line.frustumCulled = false;
    line.raycast = () => undefined;
    return line;
  }, [width, colour, renderOrder]);
  useEffect(
    () => () => {
      object.geometry.dispose();
      object.material.dispose();
    },
    [object],
  );
  useEffect(() => {
    const axes = model.axes;
    const list = entries.filter((i) => !Number.isNaN(axes[i * 6]));
    const positions = new Float32Array(list.length * 6);
    const colours = new Float32Array(list.length * 6);
    const c = model.colour.array as Uint8Array;
    list.forEach((i, k) => {
      positions.set(axes.subarray(i * 6, i * 6 + 6), k * 6);
      const v = model.entries[i].vertexStart * 3;
      for (const o of [0, 3]) {
        colours[k * 6 + o] = c[v] / 255;
        colours[k * 6 + o + 1] = c[v + 1] / 255;
        colours[k * 6 + o + 2] = c[v + 2] / 255;
      }
    });
    const geometry = new LineSegmentsGeometry();
    if (list.length) {
      geometry.setPositions(positions);
      if (!colour) geometry.setColors(colours);
    }
    object.geometry.dispose();
    object.geometry = geometry;
    object.visible = list.length > 0;
    invalidate();
  }, [object, model, entries, paintVersion, colour, invalidate]);
  useEffect(() => {
    object.material.clippingPlanes = clip ? [clip] : [];
    invalidate();
  }, [object, clip, invalidate]);
  return <primitive object={object} />;
}

/** Edge lines of some entries; big sets are computed after the current frame so colours come first. */
function useEdges(model: SceneModel, ids: readonly number[], deferred: boolean): THREE.BufferGeometry | null {
  const invalidate = useThree((s) => s.invalidate);
  const ref = useRef<THREE.BufferGeometry | null>(null);
  const [, force] = useReducerTick();
  useEffect(() => {
    let cancelled = false;
    const build = () => {
      if (cancelled) return;
      const next = ids.length ? model.edgesFor(ids) : null;
      ref.current?.dispose();
      ref.current = next;
      force();
      invalidate();
    };
    if (deferred && ids.length > 50) {
      const t = window.setTimeout(build, 30);
      return () => {
        cancelled = true;
        window.clearTimeout(t);
      };
    }
    build();
    return () => {
      cancelled = true;
    };
  }, [model, ids, deferred, invalidate, force]);
  useEffect(
    () => () => {
      ref.current?.dispose();
      ref.current = null;
    },
    [],
  );
  return ref.current;
}

function useReducerTick(): [number, () => void] {
  return useReducer((n: number) => n + 1, 0);
}

function CameraDriver({ request }: { request: CameraRequest | null }) {
  const camera = useThree((s) => s.camera) as THREE.PerspectiveCamera;
  const controls = useThree((s) => s.controls) as unknown as { target: THREE.Vector3; update(): void } | null;
  const invalidate = useThree((s) => s.invalidate);
  const size = useThree((s) => s.size);
  useEffect(() => {
    if (!request || !controls) return;
    const target = controls.target;
    if (request.kind === 'orbit') {
      const offset = camera.position.clone().sub(target);
      const s = new THREE.Spherical().setFromVector3(offset);
      s.theta += request.yaw;
      s.phi = Math.min(Math.PI - 0.01, Math.max(0.01, s.phi + request.pitch));
      camera.position.copy(target).add(new THREE.Vector3().setFromSpherical(s));
    } else if (request.kind === 'zoom') {
      const offset = camera.position.clone().sub(target).multiplyScalar(request.factor);
      camera.position.copy(target).add(offset);
    } else {
      const direction = request.kind === 'view' ? cameraPose(request.view) : camera.position.clone().sub(target).normalize();
      // Fit the box's corners, not its sphere: long thin models fill the view.
      const box = request.box.isEmpty() ? new THREE.Box3(new THREE.Vector3(-1, -1, -1), new THREE.Vector3(1, 1, 1)) : request.box;
      const centre = box.getCenter(new THREE.Vector3());
      const forward = direction.clone().negate();
      const right = new THREE.Vector3().crossVectors(forward, camera.up).normalize();
      if (right.lengthSq() < 1e-6) right.set(1, 0, 0);
      const up = new THREE.Vector3().crossVectors(right, forward).normalize();
      const aspect = size.width / Math.max(1, size.height);
      const tanV = Math.tan(THREE.MathUtils.degToRad(camera.fov) / 2);
      const tanH = tanV * aspect;
      let distance = 0.1;
      let depth = 0;
      for (let c = 0; c < 8; c++) {
        const corner = new THREE.Vector3(c & 1 ? box.max.x : box.min.x, c & 2 ? box.max.y : box.min.y, c & 4 ? box.max.z : box.min.z).sub(centre);
        const towards = -corner.dot(forward); // how far the corner sticks out towards the camera
        depth = Math.max(depth, Math.abs(towards));
        distance = Math.max(distance, towards + Math.abs(corner.dot(right)) / tanH, towards + Math.abs(corner.dot(up)) / tanV);
      }
      distance *= 1.06;
      target.copy(centre);
      camera.position.copy(centre).addScaledVector(direction, distance);
      camera.near = Math.max(distance / 1000, 0.005);
      camera.far = (distance + depth) * 20;
      camera.updateProjectionMatrix();
    }
    camera.lookAt(target);
    controls.update();
    invalidate();
    // Only a new request (new nonce) moves the camera.
  }, [request?.nonce, controls]);
  return null;
}

function Picker({ model, pickable, clip, onHover, onPick }: { model: SceneModel; pickable: (i: number) => boolean; clip: THREE.Plane | null; onHover: ModelCanvasProps['onHover']; onPick: ModelCanvasProps['onPick'] }) {
  const gl = useThree((s) => s.gl);
  const camera = useThree((s) => s.camera);
  const latest = useRef({ pickable, clip, onHover, onPick });
  latest.current = { pickable, clip, onHover, onPick };
  useEffect(() => {
    const el = gl.domElement;
    const raycaster = new THREE.Raycaster();
    const at = (ev: PointerEvent) => {
      const r = el.getBoundingClientRect();
      raycaster.setFromCamera(new THREE.Vector2(((ev.clientX - r.left) / r.width) * 2 - 1, -((ev.clientY - r.top) / r.height) * 2 + 1), camera);
      // A few pixels of slack, so thin rods can be hovered and picked.
      const fov = (camera as THREE.PerspectiveCamera).fov ?? 35;
      const slack = (6 * 2 * Math.tan(THREE.MathUtils.degToRad(fov) / 2)) / Math.max(1, r.height);
      return model.pick(raycaster.ray, latest.current.pickable, latest.current.clip, slack)?.entry ?? null;
    };
    let frame = 0;
    let down: { x: number; y: number } | null = null;
    const move = (ev: PointerEvent) => {
      if (ev.buttons) return;
      cancelAnimationFrame(frame);
      frame = requestAnimationFrame(() => latest.current.onHover(at(ev), ev.clientX, ev.clientY));
    };
    const leave = () => {
      cancelAnimationFrame(frame);
      latest.current.onHover(null, 0, 0);
    };
    const press = (ev: PointerEvent) => {
      down = { x: ev.clientX, y: ev.clientY };
    };
    const release = (ev: PointerEvent) => {
      if (!down || ev.button !== 0) return;
      const moved = Math.hypot(ev.clientX - down.x, ev.clientY - down.y);
      down = null;
      if (moved > 4) return;
      latest.current.onPick(at(ev), ev.shiftKey || ev.ctrlKey || ev.metaKey);
    };
    el.addEventListener('pointermove', move);
    el.addEventListener('pointerleave', leave);
    el.addEventListener('pointerdown', press);
    el.addEventListener('pointerup', release);
    return () => {
      cancelAnimationFrame(frame);
      el.removeEventListener('pointermove', move);
      el.removeEventListener('pointerleave', leave);
      el.removeEventListener('pointerdown', press);
      el.removeEventListener('pointerup', release);
    };
  }, [gl, camera, model]);
  return null;
}

/** Reports the draw calls of the first frame drawn with result colours. */
function FrameProbe({ coloured, onFirstColouredFrame }: { coloured: boolean; onFirstColouredFrame(drawCalls: number): void }) {
  const gl = useThree((s) => s.gl);
  const invalidate = useThree((s) => s.invalidate);
  const report = useRef(onFirstColouredFrame);
  report.current = onFirstColouredFrame;
  const done = useRef(false);
  useEffect(() => {
    if (!coloured || done.current) return;
    done.current = true;
    invalidate();
    // R3F renders in its next animation frame; read the counters in the one after.
    requestAnimationFrame(() => requestAnimationFrame(() => report.current(gl.info.render.calls)));
  }, [coloured, gl, invalidate]);
  return null;
}
