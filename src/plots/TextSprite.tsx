import { useEffect, useMemo, useState } from "react";
import { CanvasTexture, LinearFilter, SRGBColorSpace } from "three";

const FONT_FAMILY = '"Atkinson Hyperlegible", system-ui, sans-serif';
const PX = 48;

/**
 * A text label drawn into the WebGL scene itself (a sprite with a canvas texture), so it turns
 * with the chart and appears in any image taken of the canvas. Our own small piece instead of
 * drei's <Text>, which fetches a font from the network, and <Html>, which mounts one React root
 * per label.
 */
export function TextSprite({ text, position, height = 0.3, color, bold = true, anchor = "center" }: { text: string; position: [number, number, number]; height?: number; color: string; bold?: boolean; anchor?: "center" | "right" }) {
  const fontReady = useFontReady(bold);
  const { texture, aspect } = useMemo(() => drawLabel(text, color, bold), [text, color, bold, fontReady]);
  useEffect(() => () => texture.dispose(), [texture]);
  const width = height * aspect;
  return (
    <sprite position={position} scale={[width, height, 1]} center={anchor === "right" ? [1, 0.5] : [0.5, 0.5]}>
      <spriteMaterial map={texture} transparent depthWrite={false} />
    </sprite>
  );
}

function drawLabel(text: string, color: string, bold: boolean): { texture: CanvasTexture; aspect: number } {
  const canvas = document.createElement("canvas");
  const ctx = canvas.getContext("2d")!;
  const font = `${bold ? 700 : 400} ${PX}px ${FONT_FAMILY}`;
  ctx.font = font;
  const w = Math.ceil(ctx.measureText(text).width) + 8;
  canvas.width = w;
  canvas.height = Math.ceil(PX * 1.3);
  ctx.font = font;
  ctx.fillStyle = color;
  ctx.textBaseline = "middle";
  ctx.textAlign = "center";
  ctx.fillText(text, w / 2, canvas.height / 2);
  const texture = new CanvasTexture(canvas);
  texture.colorSpace = SRGBColorSpace;
  texture.minFilter = LinearFilter;
  return { texture, aspect: w / canvas.height };
}

/** Redraw once the shipped font has loaded, so labels are not left in a fallback face. */
function useFontReady(bold: boolean): boolean {
  const spec = `${bold ? 700 : 400} ${PX}px ${FONT_FAMILY}`;
  const [ready, setReady] = useState(() => typeof document === "undefined" || document.fonts.check(spec));
  useEffect(() => {
    if (ready) return;
    let live = true;
    document.fonts.load(spec).then(() => live && setReady(true), () => undefined);
    return () => {
      live = false;
    };
  }, [ready, spec]);
  return ready;
}
