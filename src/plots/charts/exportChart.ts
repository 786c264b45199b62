/**
 * Saving a chart as SVG or PNG. Recharts draws plain SVG with presentation attributes, so a
 * clone of the <svg> is a complete figure once it carries the few styles it inherits from the
 * page (font, text colour and size) and a background. Why our own and not a DOM-to-image
 * package: those clone and inline every computed style of every node, which an SVG chart does
 * not need, and they add weight to every page that shows a chart.
 * The PNG is drawn at twice the on-screen size; it uses the system sans-serif when the page's
 * font cannot be loaded inside an <img> (browsers do not share web fonts with SVG images).
 */
const SVG_NS = "http://www.w3.org/2000/svg";
const PNG_SCALE = 2;
const BACKGROUND = "#ffffff";

/** A standalone SVG document of the chart inside `container`. */
export function chartSvgText(container: HTMLElement): string {
  const svg = chartSvg(container);
  const { width, height } = svg.getBoundingClientRect();
  const clone = svg.cloneNode(true) as SVGSVGElement;
  clone.setAttribute("xmlns", SVG_NS);
  clone.setAttribute("width", String(Math.round(width)));
  clone.setAttribute("height", String(Math.round(height)));
  if (!clone.getAttribute("viewBox")) clone.setAttribute("viewBox", `0 0 ${Math.round(width)} ${Math.round(height)}`);
  const page = getComputedStyle(svg);
  clone.setAttribute("font-family", page.fontFamily);
  clone.setAttribute("font-size", page.fontSize);
  copyTextStyles(svg, clone);
  const background = document.createElementNS(SVG_NS, "rect");
  background.setAttribute("width", "100%");
  background.setAttribute("height", "100%");
  background.setAttribute("fill", BACKGROUND);
  clone.insertBefore(background, clone.firstChild);
  return new XMLSerializer().serializeToString(clone);
}

export function downloadChartSvg(container: HTMLElement, fileStem: string): void {
  download(new Blob([chartSvgText(container)], { type: "image/svg+xml" }), `${fileStem}.svg`);
}

export async function downloadChartPng(container: HTMLElement, fileStem: string): Promise<void> {
  const svg = chartSvg(container);
  const { width, height } = svg.getBoundingClientRect();
  const url = URL.createObjectURL(new Blob([chartSvgText(container)], { type: "image/svg+xml" }));
  try {
    const image = await loadImage(url);
    const canvas = document.createElement("canvas");
    canvas.width = Math.round(width * PNG_SCALE);
    canvas.height = Math.round(height * PNG_SCALE);
    const ctx = canvas.getContext("2d");
    if (!ctx) throw new Error("This browser cannot draw the PNG (no 2D canvas).");
    ctx.scale(PNG_SCALE, PNG_SCALE);
    ctx.drawImage(image, 0, 0, width, height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/png"));
    if (!blob) throw new Error("The browser could not encode the PNG.");
    download(blob, `${fileStem}.png`);
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** Lower-case, dash-separated, safe in every file system. */
export function fileStemOf(title: string): string {
  return title.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "chart";
}

function chartSvg(container: HTMLElement): SVGSVGElement {
  // The chart's own surface is the largest <svg> (legend and tooltip icons are small ones).
  const all = Array.from(container.querySelectorAll("svg"));
  const svg = all.sort((a, b) => area(b) - area(a))[0];
  if (!svg) throw new Error("There is no chart to save yet.");
  return svg;
}

function area(svg: SVGSVGElement): number {
  const r = svg.getBoundingClientRect();
  return r.width * r.height;
}

function copyTextStyles(source: SVGSVGElement, target: SVGSVGElement): void {
  const from = source.querySelectorAll("text");
  const to = target.querySelectorAll("text");
  from.forEach((node, i) => {
    const style = getComputedStyle(node);
    const out = to[i];
    if (!out) return;
    if (!out.getAttribute("fill")) out.setAttribute("fill", style.fill);
    out.setAttribute("font-size", style.fontSize);
    if (style.fontWeight !== "400") out.setAttribute("font-weight", style.fontWeight);
  });
}

function loadImage(url: string): Promise<HTMLImageElement> {
  return new Promise((resolve, reject) => {
    const image = new Image();
    image.onload = () => resolve(image);
    image.onerror = () => reject(new Error("The chart could not be drawn as an image."));
    image.src = url;
  });
}

function download(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
