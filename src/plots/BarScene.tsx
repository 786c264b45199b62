/**
 * The three.js scene of one part of ρ: a zero plane, one bar per element rising for positive
 * values and hanging for negative ones, basis labels on both horizontal axes and a vertical
 * scale. Drawn on demand (no render loop), which keeps software WebGL cheap.
 */
import { useEffect, useMemo } from "react";
import { useThree } from "@react-three/fiber";
import { Edges, OrbitControls } from "@react-three/drei";
import { BufferGeometry, Float32BufferAttribute } from "three";
import type { OrbitControls as OrbitControlsImpl } from "three-stdlib";
import { formatDecimal } from "@shared/format/uncertainty";
import { PALETTE, signColour } from "./palette";
import { TextSprite } from "./TextSprite";
import { DISTANCE_RANGE, type ViewLink } from "./viewLink";

/** World height of a bar whose value equals the shared scale. */
export const BAR_HEIGHT = 2.2;
const FOOTPRINT = 0.68;
/** Bars thinner than this are still drawn, so every element can be hovered. */
const MIN_HEIGHT = 0.015;
/** Width / height of the default view of the scene, for framing it in narrow canvases. */
const FRAME_ASPECT = 1.45;
/** Scale ticks, as fractions of the shared scale. */
const TICKS = [-1, -0.5, 0, 0.5, 1];

export interface BarSceneProps {
  values: number[][];
  labels: string[];
  scale: number;
  active: { row: number; col: number } | null;
  onHover: (at: { row: number; col: number } | null) => void;
  link: ViewLink;
  linkId: string;
}

export function BarScene({ values, labels, scale, active, onHover, link, linkId }: BarSceneProps) {
  const d = labels.length;
  const centre = (i: number) => i - (d - 1) / 2;
  const edge = d / 2 + 0.45;
  return (
    <>
      <CameraRig link={link} linkId={linkId} />
      <ambientLight intensity={1.6} />
      <directionalLight position={[4, 9, 6]} intensity={1.8} />
      <directionalLight position={[-6, 3, -4]} intensity={0.5} />
      <gridHelper args={[d, d, PALETTE.inkFaint, PALETTE.inkFaint]} />
      <mesh rotation={[-Math.PI / 2, 0, 0]} position={[0, -0.002, 0]}>
        <planeGeometry args={[d, d]} />
        <meshBasicMaterial color={PALETTE.paperSunk} transparent opacity={0.55} depthWrite={false} />
      </mesh>
      {values.map((row, i) =>
        row.map((v, j) => {
          const h = Math.max(MIN_HEIGHT, (Math.abs(v) / scale) * BAR_HEIGHT);
          const y = v < 0 ? -h / 2 : h / 2;
          const isActive = active?.row === i && active?.col === j;
          return (
            <mesh
              key={`${i}-${j}`}
              position={[centre(j), y, centre(i)]}
              onPointerOver={(e) => {
                e.stopPropagation();
                onHover({ row: i, col: j });
              }}
              onPointerOut={() => onHover(null)}
            >
              <boxGeometry args={[FOOTPRINT, h, FOOTPRINT]} />
              <meshLambertMaterial color={signColour(v)} emissive={isActive ? PALETTE.ink : "#000000"} emissiveIntensity={isActive ? 0.5 : 0} />
              <Edges color={isActive ? PALETTE.ink : PALETTE.paper} />
            </mesh>
          );
        }),
      )}
      {labels.map((l, j) => (
        <TextSprite key={`c${l}`} text={l} position={[centre(j), 0, edge]} color={PALETTE.ink} />
      ))}
      {labels.map((l, i) => (
        <TextSprite key={`r${l}`} text={l} position={[edge, 0, centre(i)]} color={PALETTE.ink} />
      ))}
      {active && <FocusFrame x={centre(active.col)} z={centre(active.row)} />}
      <VerticalScale scale={scale} x={-d / 2 - 0.3} z={d / 2 + 0.3} />
    </>
  );
}

/** A square frame on the zero plane around the pointed-at or focused element. */
function FocusFrame({ x, z }: { x: number; z: number }) {
  return (
    <mesh position={[x, 0.01, z]} rotation={[-Math.PI / 2, 0, Math.PI / 4]}>
      <ringGeometry args={[0.5, 0.62, 4, 1]} />
      <meshBasicMaterial color={PALETTE.ink} />
    </mesh>
  );
}

/** A post at the front-left corner (leftmost on screen) with ticks at ±scale and ±scale/2, shared by Re ρ and Im ρ. */
function VerticalScale({ scale, x, z }: { scale: number; x: number; z: number }) {
  const geometry = useMemo(() => {
    const g = new BufferGeometry();
    const pts: number[] = [x, -BAR_HEIGHT, z, x, BAR_HEIGHT, z];
    for (const t of TICKS) pts.push(x, t * BAR_HEIGHT, z, x - 0.12, t * BAR_HEIGHT, z + 0.12);
    g.setAttribute("position", new Float32BufferAttribute(pts, 3));
    return g;
  }, [x, z]);
  useEffect(() => () => geometry.dispose(), [geometry]);
  return (
    <>
      <lineSegments geometry={geometry}>
        <lineBasicMaterial color={PALETTE.inkFaint} />
      </lineSegments>
      {TICKS.map((t) => (
        <TextSprite key={t} text={formatDecimal(t * scale, 3)} position={[x - 0.2, t * BAR_HEIGHT, z + 0.2]} height={0.3} color={PALETTE.inkFaint} bold={false} anchor="right" />
      ))}
    </>
  );
}

/** Keeps this canvas's camera on the shared view, and publishes drags and wheel zooms to it. */
function CameraRig({ link, linkId }: { link: ViewLink; linkId: string }) {
  const camera = useThree((s) => s.camera);
  const invalidate = useThree((s) => s.invalidate);
  const controls = useThree((s) => s.controls) as OrbitControlsImpl | null;
  const aspect = useThree((s) => s.size.width / Math.max(1, s.size.height));

  // The scene is about 1.4 times as wide as it is tall; in a narrower canvas, zoom out to keep it whole.
  useEffect(() => {
    if (!("isPerspectiveCamera" in camera)) return;
    camera.zoom = Math.min(1, aspect / FRAME_ASPECT);
    camera.updateProjectionMatrix();
    invalidate();
  }, [aspect, camera, invalidate]);

  useEffect(() => {
    const apply = () => {
      const v = link.get();
      camera.position.setFromSphericalCoords(v.distance, v.polar, v.azimuth);
      camera.lookAt(0, 0, 0);
      controls?.update();
      invalidate();
    };
    apply();
    return link.subscribe((_, from) => {
      if (from !== linkId) apply();
    });
  }, [camera, controls, invalidate, link, linkId]);

  return (
    <OrbitControls
      makeDefault
      enablePan={false}
      enableDamping={false}
      minDistance={DISTANCE_RANGE.min}
      maxDistance={DISTANCE_RANGE.max}
      onChange={(e) => {
        const c = e?.target as OrbitControlsImpl | undefined;
        if (c) link.set({ azimuth: c.getAzimuthalAngle(), polar: c.getPolarAngle(), distance: c.getDistance() }, linkId);
      }}
    />
  );
}
