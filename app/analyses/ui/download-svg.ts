/** Saves the first <svg> inside `container` as a standalone SVG file (the chart as drawn). */
export function downloadSvg(container: HTMLElement | null, filename: string): void {
  const svg = container?.querySelector("svg.recharts-surface") ?? container?.querySelector("svg");
  if (!svg) return;
  const clone = svg.cloneNode(true) as SVGElement;
  clone.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  clone.setAttribute("style", "background:#ffffff;font-family:'Noto Sans',sans-serif");
  const blob = new Blob([new XMLSerializer().serializeToString(clone)], { type: "image/svg+xml" });
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
