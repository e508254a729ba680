/**
 * Exports of a drawn chart, shared by every plot (scan branches, steady-state count, time course).
 * A "figure" is the element that holds a chart's legend and its plot, at the size shown on screen.
 * The exported SVG is rebuilt from what the browser laid out: every outermost <svg> inside the
 * figure (the recharts plot with its axes and axis labels, the legend swatches) placed at its
 * offset, and every element marked `data-figure-text` (legend labels) as SVG text at its place.
 * So the picture is the figure as seen, legend included, and never a stray legend icon.
 * Browser only (DOM, canvas); the data tables are in plot-table.ts.
 */

const SVG_NS = "http://www.w3.org/2000/svg";

export interface FigureSvg {
  text: string;
  /** CSS pixels, as laid out on screen. */
  width: number;
  height: number;
}

/** The figure as a standalone SVG document at its on-screen size. */
export function figureSvg(figure: HTMLElement): FigureSvg {
  const box = figure.getBoundingClientRect();
  const width = Math.round(box.width);
  const height = Math.round(box.height);
  const root = document.createElementNS(SVG_NS, "svg");
  root.setAttribute("xmlns", SVG_NS);
  root.setAttribute("width", String(width));
  root.setAttribute("height", String(height));
  root.setAttribute("viewBox", `0 0 ${width} ${height}`);
  root.setAttribute("font-family", "'Noto Sans', sans-serif");
  const background = document.createElementNS(SVG_NS, "rect");
  background.setAttribute("width", "100%");
  background.setAttribute("height", "100%");
  background.setAttribute("fill", "#ffffff");
  root.appendChild(background);

  for (const svg of figure.querySelectorAll("svg")) {
    if (svg.parentElement?.closest("svg")) continue; // nested: travels with its outermost svg
    const r = svg.getBoundingClientRect();
    if (r.width === 0 || r.height === 0) continue;
    const clone = svg.cloneNode(true) as SVGSVGElement;
    clone.removeAttribute("style");
    clone.setAttribute("x", String(r.left - box.left));
    clone.setAttribute("y", String(r.top - box.top));
    clone.setAttribute("width", String(r.width));
    clone.setAttribute("height", String(r.height));
    if (!clone.getAttribute("viewBox")) clone.setAttribute("viewBox", `0 0 ${r.width} ${r.height}`);
    root.appendChild(clone);
  }

  for (const el of figure.querySelectorAll<HTMLElement>("[data-figure-text]")) {
    const r = el.getBoundingClientRect();
    const style = getComputedStyle(el);
    const text = document.createElementNS(SVG_NS, "text");
    text.setAttribute("x", String(r.left - box.left));
    text.setAttribute("y", String(r.top - box.top + r.height / 2));
    text.setAttribute("dominant-baseline", "central");
    text.setAttribute("font-size", style.fontSize);
    text.setAttribute("fill", style.color);
    if (style.fontWeight !== "400") text.setAttribute("font-weight", style.fontWeight);
    text.textContent = el.textContent ?? "";
    root.appendChild(text);
  }
  return { text: new XMLSerializer().serializeToString(root), width, height };
}

export function saveBlob(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function downloadFigureSvg(figure: HTMLElement, filename: string): void {
  saveBlob(new Blob([figureSvg(figure).text], { type: "image/svg+xml" }), filename);
}

/**
 * The figure as a PNG at its on-screen size times the screen's device pixel ratio (so it is as
 * sharp as on screen: 760 CSS pixels on a 2× display give 1520 pixels). White first, since PNG
 * keeps transparency.
 */
export function downloadFigurePng(figure: HTMLElement, filename: string): Promise<void> {
  const svg = figureSvg(figure);
  const scale = window.devicePixelRatio || 1;
  const url = URL.createObjectURL(new Blob([svg.text], { type: "image/svg+xml" }));
  return new Promise((resolve, reject) => {
    const image = new Image();
    image.onerror = () => {
      URL.revokeObjectURL(url);
      reject(new Error("the chart could not be drawn as an image"));
    };
    image.onload = () => {
      const canvas = document.createElement("canvas");
      canvas.width = Math.round(svg.width * scale);
      canvas.height = Math.round(svg.height * scale);
      const ctx = canvas.getContext("2d");
      URL.revokeObjectURL(url);
      if (!ctx) return reject(new Error("no canvas"));
      ctx.fillStyle = "#ffffff";
      ctx.fillRect(0, 0, canvas.width, canvas.height);
      ctx.drawImage(image, 0, 0, canvas.width, canvas.height);
      canvas.toBlob((blob) => {
        if (blob) saveBlob(blob, filename);
        resolve();
      }, "image/png");
    };
    image.src = url;
  });
}

export function downloadCsv(csv: string, filename: string): void {
  saveBlob(new Blob([csv], { type: "text/csv;charset=utf-8" }), filename);
}
