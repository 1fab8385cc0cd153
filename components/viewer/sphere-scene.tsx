"use client";

import { useEffect, useMemo } from "react";
import * as THREE from "three";
import { GAP_WORTH_FILLING_DEG } from "@/geometry/orientation-words";
import type { Vec3 } from "@/geometry/types";
import { LabelSprite } from "./label-sprite";
import { OrbitRig } from "./orbit-rig";
import type { OrbitStore } from "./orbit-state";
import type { CloudKind, SceneModel, SceneSurface } from "./scene-model";
import type { ScenePalette } from "./scene-palette";

/** One BufferGeometry per array, made when the array changes and released after. */
function useGeometry(positions: Float32Array | null | undefined, colours?: Float32Array | null): THREE.BufferGeometry | null {
  const geometry = useMemo(() => {
    if (!positions || positions.length === 0) return null;
    const g = new THREE.BufferGeometry();
    g.setAttribute("position", new THREE.BufferAttribute(positions, 3));
    if (colours) g.setAttribute("color", new THREE.BufferAttribute(colours, 4));
    g.computeBoundingSphere();
    return g;
  }, [positions, colours]);
  useEffect(() => () => geometry?.dispose(), [geometry]);
  return geometry;
}

/**
 * Stripes for empty cells, fixed to the unit sphere (object space) so they follow the cell
 * onto the ellipsoid: planes x + y − z = const cut the sphere in parallel circles, a hatching
 * that reads at any angle, over a faint wash of the same colour.
 */
function useHatchMaterial(colour: string): THREE.ShaderMaterial {
  const material = useMemo(
    () =>
      new THREE.ShaderMaterial({
        uniforms: { colour: { value: new THREE.Color(colour) } },
        vertexShader: `varying vec3 vUnit;
void main() { vUnit = position; gl_Position = projectionMatrix * modelViewMatrix * vec4(position, 1.0); }`,
        fragmentShader: `uniform vec3 colour;
varying vec3 vUnit;
void main() {
  float stripe = step(0.55, fract((vUnit.x + vUnit.y - vUnit.z) * 14.0));
  gl_FragColor = vec4(colour, mix(0.1, 0.7, stripe));
  #include <colorspace_fragment>
}`,
        transparent: true,
        depthWrite: false,
        side: THREE.FrontSide,
      }),
    [colour],
  );
  useEffect(() => () => material.dispose(), [material]);
  return material;
}

function surfaceMatrix(surface: SceneSurface): THREE.Matrix4 {
  const [r0, r1, r2] = surface.linear;
  const [cx, cy, cz] = surface.centre;
  return new THREE.Matrix4().set(r0[0], r0[1], r0[2], cx, r1[0], r1[1], r1[2], cy, r2[0], r2[1], r2[2], cz, 0, 0, 0, 1);
}

function onSurface(surface: SceneSurface, u: Vec3, lift: number): [number, number, number] {
  const m = surface.linear;
  const c = surface.centre;
  return [0, 1, 2].map((r) => c[r] + lift * (m[r][0] * u[0] + m[r][1] * u[1] + m[r][2] * u[2])) as [number, number, number];
}

function Cloud({ positions, colour, size }: { positions: Float32Array | null; colour: string; size: number }) {
  const geometry = useGeometry(positions);
  if (!geometry) return null;
  return (
    <points geometry={geometry}>
      <pointsMaterial color={colour} size={size} sizeAttenuation={false} />
    </points>
  );
}

const AXIS_LENGTH = 1.45;
const AXES: { label: string; direction: Vec3 }[] = [
  { label: "x forward", direction: [1, 0, 0] },
  { label: "y right", direction: [0, 1, 0] },
  { label: "z down", direction: [0, 0, 1] },
];

/** Body axes from the zero-field origin, positive halves solid and labelled, negative halves faint. */
function BodyAxes({ palette }: { palette: ScenePalette }) {
  const positive = useMemo(
    () => Float32Array.from(AXES.flatMap(({ direction: d }) => [0, 0, 0, d[0] * AXIS_LENGTH, d[1] * AXIS_LENGTH, d[2] * AXIS_LENGTH])),
    [],
  );
  const negative = useMemo(
    () => Float32Array.from(AXES.flatMap(({ direction: d }) => [0, 0, 0, -d[0] * AXIS_LENGTH, -d[1] * AXIS_LENGTH, -d[2] * AXIS_LENGTH])),
    [],
  );
  const solid = useGeometry(positive);
  const faint = useGeometry(negative);
  return (
    <group>
      {solid ? (
        <lineSegments geometry={solid}>
          <lineBasicMaterial color={palette.ink} />
        </lineSegments>
      ) : null}
      {faint ? (
        <lineSegments geometry={faint}>
          <lineBasicMaterial color={palette.ink} transparent opacity={0.3} />
        </lineSegments>
      ) : null}
      {AXES.map(({ label, direction: d }) => (
        <LabelSprite
          key={label}
          text={label}
          position={[d[0] * 1.62, d[1] * 1.62, d[2] * 1.62]}
          colour={palette.ink}
          halo={palette.paper}
        />
      ))}
    </group>
  );
}

/** Everything on the coverage surface: wireframe, cells and the largest gap, carried by one matrix. */
function Surface({
  model,
  surface,
  palette,
  showCells,
}: {
  model: SceneModel;
  surface: SceneSurface;
  palette: ScenePalette;
  showCells: boolean;
}) {
  const matrix = useMemo(() => surfaceMatrix(surface), [surface]);
  const wire = useGeometry(model.wireframe);
  const covered = useGeometry(model.coverage?.covered.positions, model.coverage?.covered.colours);
  const empty = useGeometry(model.coverage?.empty.positions);
  const rim = useGeometry(model.gap?.rim);
  const marker = useGeometry(model.gap?.marker);
  const dot = useGeometry(model.gap?.dot);
  const hatch = useHatchMaterial(palette.empty);
  return (
    <group matrix={matrix} matrixAutoUpdate={false}>
      {wire ? (
        <lineSegments geometry={wire}>
          <lineBasicMaterial color={palette.muted} transparent opacity={surface.source === "fit" ? 0.45 : 0.2} depthWrite={false} />
        </lineSegments>
      ) : null}
      {showCells && covered ? (
        <mesh geometry={covered} renderOrder={1}>
          <meshBasicMaterial color={palette.cell} vertexColors transparent depthWrite={false} side={THREE.FrontSide} />
        </mesh>
      ) : null}
      {showCells && empty ? <mesh geometry={empty} material={hatch} renderOrder={2} /> : null}
      {rim ? (
        <mesh geometry={rim} renderOrder={3}>
          <meshBasicMaterial color={palette.ink} side={THREE.FrontSide} />
        </mesh>
      ) : null}
      {marker ? (
        <mesh geometry={marker} renderOrder={3}>
          <meshBasicMaterial color={palette.ink} side={THREE.FrontSide} />
        </mesh>
      ) : null}
      {dot ? (
        <mesh geometry={dot} renderOrder={3}>
          <meshBasicMaterial color={palette.ink} side={THREE.FrontSide} />
        </mesh>
      ) : null}
    </group>
  );
}

/** A round dot for point sprites (three draws points as squares): a disc, made once. */
function useDiscTexture(): THREE.Texture {
  const texture = useMemo(() => {
    const canvas = document.createElement("canvas");
    canvas.width = canvas.height = 32;
    const context = canvas.getContext("2d")!;
    context.beginPath();
    context.arc(16, 16, 15, 0, 2 * Math.PI);
    context.fillStyle = "#ffffff";
    context.fill();
    return new THREE.CanvasTexture(canvas);
  }, []);
  useEffect(() => () => texture.dispose(), [texture]);
  return texture;
}

function Pairs({ model, palette }: { model: SceneModel; palette: ScenePalette }) {
  const disc = useDiscTexture();
  const first = useGeometry(model.pairs?.firstDots);
  const others = useGeometry(model.pairs?.otherDots);
  const links = useGeometry(model.pairs?.links);
  return (
    <group>
      {links ? (
        <lineSegments geometry={links}>
          <lineBasicMaterial color={palette.muted} transparent opacity={0.8} />
        </lineSegments>
      ) : null}
      {first ? (
        <points geometry={first}>
          <pointsMaterial color={palette.compasses[0]} size={7} sizeAttenuation={false} map={disc} alphaTest={0.5} />
        </points>
      ) : null}
      {others ? (
        <points geometry={others}>
          <pointsMaterial color={palette.compasses[1]} size={7} sizeAttenuation={false} map={disc} alphaTest={0.5} />
        </points>
      ) : null}
    </group>
  );
}

/** A line from the zero-field origin to the raw ellipsoid's centre: the hard-iron offset. */
function OffsetMark({ centre, palette }: { centre: Vec3; palette: ScenePalette }) {
  const positions = useMemo(() => Float32Array.from([0, 0, 0, ...centre]), [centre]);
  const line = useGeometry(positions);
  const length = Math.hypot(...centre);
  return (
    <group>
      {line ? (
        <lineSegments geometry={line}>
          <lineBasicMaterial color={palette.empty} />
        </lineSegments>
      ) : null}
      {length > 0.05 ? (
        <LabelSprite
          text="offset"
          position={[centre[0] / 2, centre[1] / 2, centre[2] / 2]}
          colour={palette.ink}
          halo={palette.paper}
          sizePx={12}
        />
      ) : null}
    </group>
  );
}

export interface SphereSceneProps {
  model: SceneModel;
  kind: CloudKind;
  /** The compass whose fit and coverage are drawn. */
  chosen: string;
  palette: ScenePalette;
  showCells: boolean;
  showPairs: boolean;
  store: OrbitStore;
}

/** The contents of one canvas: clouds, the coverage surface, body axes, and the camera rig. */
export function SphereScene({ model, kind, chosen, palette, showCells, showPairs, store }: SphereSceneProps) {
  const surface = kind === "corrected" && model.surfaces.corrected ? model.surfaces.corrected : model.surfaces.raw;
  return (
    <>
      <OrbitRig store={store} target={surface.centre} />
      {model.clouds.map((cloud, k) => (
        <Cloud
          key={cloud.sensor}
          positions={kind === "raw" ? cloud.raw : cloud.corrected}
          colour={palette.compasses[k % palette.compasses.length]}
          size={cloud.sensor === chosen ? 2.6 : 2}
        />
      ))}
      <Surface model={model} surface={surface} palette={palette} showCells={showCells} />
      {model.gap && model.gap.radiusDeg >= GAP_WORTH_FILLING_DEG ? (
        <LabelSprite
          text={`gap ${Math.round(model.gap.radiusDeg)}°`}
          position={onSurface(surface, model.gap.centre, 1.16)}
          colour={palette.ink}
          halo={palette.paper}
          sizePx={12}
        />
      ) : null}
      <BodyAxes palette={palette} />
      {kind === "raw" && surface.source === "fit" ? <OffsetMark centre={surface.centre} palette={palette} /> : null}
      {kind === "corrected" && showPairs && model.pairs ? <Pairs model={model} palette={palette} /> : null}
    </>
  );
}
