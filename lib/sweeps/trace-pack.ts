// A sweep run's result as the server keeps it until the whole sweep is done: the chosen receivers'
// pressure traces, float32 exactly as the solver recorded them, zlib-compressed behind a small JSON
// header (u32 LE header length | header JSON | padding to 4 bytes | float32 samples, trace after trace).
import { unzlibSync, zlibSync } from "fflate";
import { z } from "zod";
import type { PressureTrace } from "@/lib/analysis/band-levels";

const headerSchema = z.object({
  traces: z.array(z.object({ id: z.string(), label: z.string(), timeStep: z.number().positive(), samples: z.number().int().min(0) }).strict()),
});

export function packTraces(traces: readonly PressureTrace[]): Uint8Array {
  const header = new TextEncoder().encode(JSON.stringify({ traces: traces.map((t) => ({ id: t.id, label: t.label, timeStep: t.timeStep, samples: t.pressure.length })) }));
  const dataStart = Math.ceil((4 + header.length) / 4) * 4;
  const total = dataStart + 4 * traces.reduce((sum, t) => sum + t.pressure.length, 0);
  const body = new Uint8Array(total);
  const view = new DataView(body.buffer);
  view.setUint32(0, header.length, true);
  body.set(header, 4);
  let offset = dataStart;
  for (const trace of traces) {
    for (let n = 0; n < trace.pressure.length; n++, offset += 4) view.setFloat32(offset, trace.pressure[n]!, true);
  }
  return zlibSync(body, { level: 4 });
}

/** The traces back, or a message saying why the bytes are not a pack. */
export function unpackTraces(bytes: Uint8Array): { ok: true; traces: PressureTrace[] } | { ok: false; message: string } {
  try {
    const body = unzlibSync(bytes);
    const view = new DataView(body.buffer, body.byteOffset, body.byteLength);
    const headerLength = view.getUint32(0, true);
    const parsed = headerSchema.safeParse(JSON.parse(new TextDecoder().decode(body.subarray(4, 4 + headerLength))));
    if (!parsed.success) return { ok: false, message: "the trace header is not valid" };
    let offset = Math.ceil((4 + headerLength) / 4) * 4;
    const traces: PressureTrace[] = [];
    for (const entry of parsed.data.traces) {
      if (offset + 4 * entry.samples > body.byteLength) return { ok: false, message: "the traces are shorter than their header says" };
      const pressure = new Float32Array(entry.samples);
      for (let n = 0; n < entry.samples; n++, offset += 4) pressure[n] = view.getFloat32(offset, true);
      traces.push({ id: entry.id, label: entry.label, timeStep: entry.timeStep, pressure });
    }
    if (offset !== body.byteLength) return { ok: false, message: "the traces are longer than their header says" };
    return { ok: true, traces };
  } catch (error) {
    return { ok: false, message: `the traces could not be read (${error instanceof Error ? error.message : "unknown error"})` };
  }
}
