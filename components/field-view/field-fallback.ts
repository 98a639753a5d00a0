// The field layer without WebGL: the same colour table applied on the CPU (field-colouring.ts), the
// pixels put into a grid-sized canvas with putImageData, then scaled onto the view unsmoothed so each
// cell stays a crisp square, exactly as the WebGL layer draws it. Slower, but the same picture.
import { rasteriseField } from "./field-colouring";
import type { FieldRenderer } from "./field-renderer";
import type { Rect } from "./view-layout";

interface GridImage {
  canvas: HTMLCanvasElement;
  context: CanvasRenderingContext2D;
  image: ImageData;
}

/** Creates the 2D-canvas renderer; throws when even a 2D context is unavailable. */
export function createCanvasFieldRenderer(canvas: HTMLCanvasElement): FieldRenderer {
  const context = canvas.getContext("2d");
  if (!context) throw new Error("this browser gives no 2D canvas context either");
  const grids = new Map<string, GridImage>();

  function gridImage(width: number, height: number): GridImage {
    const key = `${width}x${height}`;
    let grid = grids.get(key);
    if (!grid) {
      const gridCanvas = document.createElement("canvas");
      gridCanvas.width = width;
      gridCanvas.height = height;
      const gridContext = gridCanvas.getContext("2d");
      if (!gridContext) throw new Error("this browser gives no 2D canvas context");
      grid = { canvas: gridCanvas, context: gridContext, image: gridContext.createImageData(width, height) };
      grids.set(key, grid);
    }
    return grid;
  }

  // Frames give rectangles with the origin bottom-left (the WebGL convention); the 2D canvas's is top-left.
  const top = (rect: Rect) => canvas.height - rect.y - rect.height;

  return {
    kind: "canvas-2d",
    render(frame) {
      const grid = gridImage(frame.width, frame.height);
      rasteriseField(frame.values, frame.width, frame.height, { low: frame.low, high: frame.high, lut: frame.scale.lut }, grid.image.data);
      grid.context.putImageData(grid.image, 0, 0);
      context.setTransform(1, 0, 0, 1, 0, 0);
      context.clearRect(0, 0, canvas.width, canvas.height);
      context.save();
      context.beginPath();
      context.rect(frame.clip.x, top(frame.clip), frame.clip.width, frame.clip.height);
      context.clip();
      context.imageSmoothingEnabled = false;
      context.drawImage(grid.canvas, frame.viewport.x, top(frame.viewport), frame.viewport.width, frame.viewport.height);
      context.restore();
    },
    clear() {
      context.setTransform(1, 0, 0, 1, 0, 0);
      context.clearRect(0, 0, canvas.width, canvas.height);
    },
    destroy() {
      grids.clear();
    },
  };
}
