import type { Locator } from "playwright-core";

export interface CanvasColours {
  width: number;
  height: number;
  /** Share of pixels close to the palette's positive (blue) and negative (orange) colours. */
  positive: number;
  negative: number;
  /** Standard deviation of pixel brightness (0 for a blank canvas). */
  brightnessSpread: number;
}

/**
 * Reads back what a WebGL canvas drew (toDataURL works because the 3D view keeps its drawing
 * buffer) and measures it: a blank or failed canvas has no spread and none of our bar colours.
 */
export async function canvasColours(canvas: Locator, positive: string, negative: string): Promise<CanvasColours> {
  return canvas.evaluate(
    async (el, [pos, neg]) => {
      const c = el as HTMLCanvasElement;
      const img = new Image();
      img.src = c.toDataURL("image/png");
      await img.decode();
      const copy = document.createElement("canvas");
      copy.width = img.width;
      copy.height = img.height;
      const g = copy.getContext("2d")!;
      g.drawImage(img, 0, 0);
      const d = g.getImageData(0, 0, copy.width, copy.height).data;
      const rgb = (hex: string) => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
      const [p, n] = [rgb(pos), rgb(neg)];
      const near = (r: number, gg: number, b: number, t: number[]) => Math.abs(r - t[0]) + Math.abs(gg - t[1]) + Math.abs(b - t[2]) < 150;
      let nPos = 0;
      let nNeg = 0;
      let sum = 0;
      let sum2 = 0;
      const count = d.length / 4;
      for (let i = 0; i < d.length; i += 4) {
        const [r, gg, b] = [d[i], d[i + 1], d[i + 2]];
        if (near(r, gg, b, p)) nPos++;
        else if (near(r, gg, b, n)) nNeg++;
        const y = 0.2126 * r + 0.7152 * gg + 0.0722 * b;
        sum += y;
        sum2 += y * y;
      }
      const mean = sum / count;
      return { width: copy.width, height: copy.height, positive: nPos / count, negative: nNeg / count, brightnessSpread: Math.sqrt(Math.max(0, sum2 / count - mean * mean)) };
    },
    [positive, negative] as const,
  );
}
