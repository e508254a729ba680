/** The chart's <svg> as a standalone document (white background, our font), or null when none is drawn. */
function standaloneSvg(container: HTMLElement | null): { text: string; width: number; height: number } | null {
  const svg = container?.querySelector("svg.recharts-surface") ?? container?.querySelector("svg");
  if (!svg) return null;
  const clone = svg.cloneNode(true) as SVGElement;
  clone.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  clone.setAttribute("style", "background:#ffffff;font-family:'Noto Sans',sans-serif");
  const box = svg.getBoundingClientRect();
  return { text: new XMLSerializer().serializeToString(clone), width: box.width, height: box.height };
}

function saveBlob(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/** Saves the first <svg> inside `container` as a standalone SVG file (the chart as drawn). */
export function downloadSvg(container: HTMLElement | null, filename: string): void {
  const svg = standaloneSvg(container);
  if (svg) saveBlob(new Blob([svg.text], { type: "image/svg+xml" }), filename);
}

/**
 * Saves the chart as a PNG at twice its on-screen size, for slides and lab notebooks.
 * The SVG is drawn onto a canvas through an <img>; a white fill first, since PNG keeps transparency.
 */
export function downloadPng(container: HTMLElement | null, filename: string, scale = 2): void {
  const svg = standaloneSvg(container);
  if (!svg) return;
  const image = new Image();
  const url = URL.createObjectURL(new Blob([svg.text], { type: "image/svg+xml" }));
  image.onload = () => {
    const canvas = document.createElement("canvas");
    canvas.width = Math.ceil(svg.width * scale);
    canvas.height = Math.ceil(svg.height * scale);
    const ctx = canvas.getContext("2d");
    if (!ctx) return;
    ctx.fillStyle = "#ffffff";
    ctx.fillRect(0, 0, canvas.width, canvas.height);
    ctx.drawImage(image, 0, 0, canvas.width, canvas.height);
    URL.revokeObjectURL(url);
    canvas.toBlob((blob) => blob && saveBlob(blob, filename), "image/png");
  };
  image.src = url;
}
