// Files the analysis hands out: CSV text, chart pictures as PNG (uPlot's canvas, or an SVG chart drawn
// onto a canvas), each saved through the field view's downloadBlob.
import { downloadBlob } from "@/components/field-view/field-view-toolbar";

export function downloadCsv(text: string, fileName: string): void {
  downloadBlob(new Blob([text], { type: "text/csv;charset=utf-8" }), fileName);
}

function canvasToPng(canvas: HTMLCanvasElement): Promise<Blob> {
  return new Promise((resolve, reject) => canvas.toBlob((blob) => (blob ? resolve(blob) : reject(new Error("the browser could not encode the PNG"))), "image/png"));
}

export interface LegendEntry {
  label: string;
  colour: string;
  dash?: number[];
}

/**
 * The uPlot canvas inside `container` on a white page with a title and the series' colours above it (the
 * live legend is HTML and would otherwise be lost).
 */
export async function uplotChartPng(container: HTMLElement, title: string, legend: readonly LegendEntry[]): Promise<Blob> {
  const plot = container.querySelector<HTMLCanvasElement>(".uplot canvas");
  if (!plot) throw new Error("the chart is not drawn yet");
  const ratio = plot.width / Math.max(1, plot.clientWidth || plot.width);
  const font = getComputedStyle(container).fontFamily || "sans-serif";
  const line = Math.round(18 * ratio);
  const legendLines = Math.ceil(legend.length / 3);
  const top = line * (1.6 + legendLines);
  const out = document.createElement("canvas");
  out.width = plot.width;
  out.height = plot.height + Math.round(top);
  const context = out.getContext("2d");
  if (!context) throw new Error("no 2D canvas to compose the PNG on");
  context.fillStyle = "#ffffff";
  context.fillRect(0, 0, out.width, out.height);
  context.fillStyle = "#1d2630";
  context.textBaseline = "middle";
  context.font = `600 ${Math.round(13 * ratio)}px ${font}`;
  context.fillText(title, 8 * ratio, line * 0.7);
  context.font = `${Math.round(11 * ratio)}px ${font}`;
  const column = out.width / 3;
  legend.forEach((entry, i) => {
    const x = 8 * ratio + (i % 3) * column;
    const y = line * (1.6 + Math.floor(i / 3));
    context.strokeStyle = entry.colour;
    context.lineWidth = 3 * ratio;
    context.setLineDash((entry.dash ?? []).map((d) => d * ratio));
    context.beginPath();
    context.moveTo(x, y);
    context.lineTo(x + 16 * ratio, y);
    context.stroke();
    context.setLineDash([]);
    context.fillStyle = "#1d2630";
    context.fillText(entry.label, x + 22 * ratio, y, column - 30 * ratio);
  });
  context.drawImage(plot, 0, Math.round(top));
  return canvasToPng(out);
}

/** An inline SVG chart drawn at twice its size onto a white canvas. */
export async function svgChartPng(svg: SVGSVGElement): Promise<Blob> {
  const box = svg.getBoundingClientRect();
  const width = Math.max(1, Math.round(box.width));
  const height = Math.max(1, Math.round(box.height));
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute("width", String(width));
  copy.setAttribute("height", String(height));
  copy.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  // Text in the SVG takes the page's font, which a detached image does not know: name it in the copy.
  copy.setAttribute("font-family", getComputedStyle(svg).fontFamily || "sans-serif");
  const url = URL.createObjectURL(new Blob([new XMLSerializer().serializeToString(copy)], { type: "image/svg+xml" }));
  try {
    const image = new Image();
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error("the chart could not be drawn as an image"));
      image.src = url;
    });
    const scale = 2;
    const out = document.createElement("canvas");
    out.width = width * scale;
    out.height = height * scale;
    const context = out.getContext("2d");
    if (!context) throw new Error("no 2D canvas to draw the PNG on");
    context.fillStyle = "#ffffff";
    context.fillRect(0, 0, out.width, out.height);
    context.drawImage(image, 0, 0, out.width, out.height);
    return await canvasToPng(out);
  } finally {
    URL.revokeObjectURL(url);
  }
}

/** "run-1a2b3c-traces.csv": a short run id and what the file holds. */
export function exportFileName(runId: string, what: string, extension: string): string {
  return `run-${runId.slice(0, 8)}-${what}.${extension}`;
}
