"use client";
/// Downloads of a plot: its SVG as a file, and a PNG drawn from that SVG on a canvas in the
/// browser (twice the size, for print).
export function svgText(svg: SVGSVGElement): string {
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  copy.removeAttribute("class");
  return `<?xml version="1.0" encoding="UTF-8"?>\n${new XMLSerializer().serializeToString(copy)}\n`;
}

export function saveBlob(blob: Blob, name: string): void {
  const a = document.createElement("a");
  a.href = URL.createObjectURL(blob);
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  window.setTimeout(() => URL.revokeObjectURL(a.href), 10_000);
}

export function downloadSvg(svg: SVGSVGElement, name: string): void {
  saveBlob(new Blob([svgText(svg)], { type: "image/svg+xml" }), `${name}.svg`);
}

export async function downloadPng(svg: SVGSVGElement, name: string, scale = 2): Promise<void> {
  const width = Number(svg.getAttribute("width"));
  const height = Number(svg.getAttribute("height"));
  const url = URL.createObjectURL(new Blob([svgText(svg)], { type: "image/svg+xml" }));
  try {
    const image = new Image();
    image.width = width;
    image.height = height;
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error("the browser could not draw the SVG"));
      image.src = url;
    });
    const canvas = document.createElement("canvas");
    canvas.width = width * scale;
    canvas.height = height * scale;
    const g = canvas.getContext("2d");
    if (!g) throw new Error("no 2D canvas in this browser");
    g.scale(scale, scale);
    g.drawImage(image, 0, 0, width, height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/png"));
    if (!blob) throw new Error("the canvas gave no PNG");
    saveBlob(blob, `${name}.png`);
  } finally {
    URL.revokeObjectURL(url);
  }
}
