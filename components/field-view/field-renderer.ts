// The WebGL layer of the field view: regl resources (a value texture per grid size, a colour table per
// scale) and one draw command, so each frame only uploads the new values and draws a quad. The colour
// mapping runs in the fragment shader. Without OES_texture_float (some WebGL1 devices) the values are
// mapped to bytes on the CPU with the current range and uploaded as a LUMINANCE/UNSIGNED_BYTE texture.
// Nothing is allocated per frame: textures and byte buffers are created once per grid size and reused.
import createREGL from "regl";

import type { ColourScale } from "./colour-scales";
import { encodeNormalisedBytes } from "./field-colouring";
import type { Rect } from "./view-layout";

/** One picture of a field: row-major values (a fastest, row 0 at the bottom) and where and how to draw them. */
export interface FieldFrame {
  values: Float32Array;
  width: number;
  height: number;
  /** Values mapped to the low and high ends of the scale. */
  low: number;
  high: number;
  scale: ColourScale;
  /** Where the field's cells land, device px, origin bottom-left (gl.viewport's convention). */
  viewport: Rect;
  /** Drawing is clipped to this rectangle, same convention (the plot area). */
  clip: Rect;
}

/** Draws field frames onto one canvas; the WebGL renderer and the 2D fallback both implement it. */
export interface FieldRenderer {
  readonly kind: "webgl-float" | "webgl-bytes" | "canvas-2d";
  /** Uploads the frame's values and draws them; the canvas must already have its device-pixel size. */
  render(frame: FieldFrame): void;
  /** Empties the canvas (no field to show). */
  clear(): void;
  destroy(): void;
}

export interface WebGlFieldRendererOptions {
  /** Use the byte-texture path even where float textures work (to exercise it in the harness). */
  forceByteTextures?: boolean;
}

/** Thrown when the browser gives no WebGL context; the view then falls back to a 2D canvas. */
export class WebGlUnavailableError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "WebGlUnavailableError";
  }
}

// The quad covers the viewport; `corner` doubles as the texture coordinate, so texture row 0 (the bottom
// row of the field, y up) lands at the bottom of the viewport without any flip.
const vertexShader = `
precision highp float;
attribute vec2 corner;
varying vec2 uv;
void main() {
  uv = corner;
  gl_Position = vec4(2.0 * corner - 1.0, 0.0, 1.0);
}`;

// t = (v - low) / (high - low), clamped; the table is sampled at texel centres (t = 0 -> entry 0,
// t = 1 -> entry 255) with linear filtering between entries. For byte textures low = 0, high = 1.
const fragmentShader = `
#ifdef GL_FRAGMENT_PRECISION_HIGH
precision highp float;
#else
precision mediump float;
#endif
uniform sampler2D field;
uniform sampler2D lut;
uniform float low;
uniform float high;
varying vec2 uv;
void main() {
  float value = texture2D(field, uv).r;
  float t = clamp((value - low) / (high - low), 0.0, 1.0);
  gl_FragColor = texture2D(lut, vec2((t * 255.0 + 0.5) / 256.0, 0.5));
}`;

interface DrawProps {
  field: createREGL.Texture2D;
  lut: createREGL.Texture2D;
  low: number;
  high: number;
  viewport: { x: number; y: number; width: number; height: number };
  clip: { x: number; y: number; width: number; height: number };
}

interface GridResources {
  texture: createREGL.Texture2D;
  /** Only on the byte path: the values mapped to 0..255 with the current range. */
  bytes?: Uint8Array;
}

/** Creates the WebGL renderer on `canvas`; throws WebGlUnavailableError when there is no WebGL. */
export function createWebGlFieldRenderer(canvas: HTMLCanvasElement, options: WebGlFieldRendererOptions = {}): FieldRenderer {
  // preserveDrawingBuffer stays off (it costs a copy per frame); the PNG export redraws before reading.
  const gl = canvas.getContext("webgl", { alpha: true, antialias: false, depth: false, stencil: false, premultipliedAlpha: true, preserveDrawingBuffer: false });
  if (!gl) throw new WebGlUnavailableError("this browser gives no WebGL context");
  let regl: createREGL.Regl;
  try {
    regl = createREGL({ gl, optionalExtensions: ["OES_texture_float"] });
  } catch (error) {
    throw new WebGlUnavailableError(error instanceof Error ? error.message : String(error));
  }
  const useFloat = regl.hasExtension("OES_texture_float") && !options.forceByteTextures;

  const corners = regl.buffer([
    [0, 0],
    [1, 0],
    [0, 1],
    [1, 1],
  ]);
  const drawField = regl<Record<string, unknown>, Record<string, unknown>, DrawProps>({
    vert: vertexShader,
    frag: fragmentShader,
    attributes: { corner: corners },
    uniforms: {
      field: regl.prop<DrawProps, "field">("field"),
      lut: regl.prop<DrawProps, "lut">("lut"),
      low: regl.prop<DrawProps, "low">("low"),
      high: regl.prop<DrawProps, "high">("high"),
    },
    viewport: regl.prop<DrawProps, "viewport">("viewport"),
    scissor: { enable: true, box: regl.prop<DrawProps, "clip">("clip") },
    depth: { enable: false },
    primitive: "triangle strip",
    count: 4,
  });

  const grids = new Map<string, GridResources>();
  const tables = new Map<ColourScale["id"], createREGL.Texture2D>();
  // Reused every frame so drawing allocates nothing.
  const props: DrawProps = { field: undefined as never, lut: undefined as never, low: 0, high: 1, viewport: { x: 0, y: 0, width: 1, height: 1 }, clip: { x: 0, y: 0, width: 1, height: 1 } };
  const clearColour = { color: [0, 0, 0, 0] as [number, number, number, number] };

  function gridResources(width: number, height: number): GridResources {
    const key = `${width}x${height}`;
    let resources = grids.get(key);
    if (!resources) {
      const texture = regl.texture({ width, height, format: "luminance", type: useFloat ? "float" : "uint8", min: "nearest", mag: "nearest", wrapS: "clamp", wrapT: "clamp" });
      resources = useFloat ? { texture } : { texture, bytes: new Uint8Array(width * height) };
      grids.set(key, resources);
    }
    return resources;
  }

  function colourTable(scale: ColourScale): createREGL.Texture2D {
    let table = tables.get(scale.id);
    if (!table) {
      table = regl.texture({ width: scale.lut.length / 4, height: 1, data: scale.lut, format: "rgba", type: "uint8", min: "linear", mag: "linear", wrapS: "clamp", wrapT: "clamp" });
      tables.set(scale.id, table);
    }
    return table;
  }

  function setBox(target: DrawProps["viewport"], rect: Rect): void {
    // gl.viewport and gl.scissor take whole pixels: round each edge, not the size, so neighbours meet.
    const left = Math.round(rect.x);
    const bottom = Math.round(rect.y);
    target.x = left;
    target.y = bottom;
    target.width = Math.max(1, Math.round(rect.x + rect.width) - left);
    target.height = Math.max(1, Math.round(rect.y + rect.height) - bottom);
  }

  return {
    kind: useFloat ? "webgl-float" : "webgl-bytes",
    render(frame) {
      if (frame.values.length !== frame.width * frame.height) throw new RangeError(`a ${frame.width} x ${frame.height} field needs ${frame.width * frame.height} values, got ${frame.values.length}`);
      regl.poll();
      const resources = gridResources(frame.width, frame.height);
      if (resources.bytes) {
        encodeNormalisedBytes(frame.values, frame.low, frame.high, resources.bytes);
        resources.texture.subimage(resources.bytes);
        props.low = 0;
        props.high = 1;
      } else {
        resources.texture.subimage(frame.values);
        props.low = frame.low;
        props.high = frame.high;
      }
      props.field = resources.texture;
      props.lut = colourTable(frame.scale);
      setBox(props.viewport, frame.viewport);
      setBox(props.clip, frame.clip);
      regl.clear(clearColour);
      drawField(props);
    },
    clear() {
      regl.poll();
      regl.clear(clearColour);
    },
    destroy() {
      // Back to the default GL state (scissor off), so a renderer made next on the same context (React's
      // development double mount) starts clean; then regl.destroy frees every texture, buffer and program.
      regl.poll();
      grids.clear();
      tables.clear();
      regl.destroy();
    },
  };
}
