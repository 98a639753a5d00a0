// How a pin reads on its chip and in tooltips: "x 12.4 m, y 1.5 m, t 35.2 ms" on the field, or
// "Receiver R2 at 35.2 ms" on a trace.
import type { CommentPin } from "@/lib/validation/comment";

/** Milliseconds with three significant figures, at least one decimal: 35.2 ms, 0.125 ms, 120.0 ms. */
export function formatPinTime(seconds: number): string {
  const ms = seconds * 1000;
  const decimals = ms >= 100 ? 1 : ms >= 10 ? 1 : ms >= 1 ? 2 : 3;
  return `${ms.toFixed(decimals)} ms`;
}

/** Metres to the centimetre, trailing zeros dropped: 12.4 m, 1.05 m. */
export function formatPinMetres(metres: number): string {
  return `${Number(metres.toFixed(2))} m`;
}

export function formatPin(pin: CommentPin, receiverLabel: (receiverId: string) => string = (id) => id): string {
  if (pin.kind === "field") return `x ${formatPinMetres(pin.x)}, y ${formatPinMetres(pin.y)}, t ${formatPinTime(pin.t)}`;
  return `Receiver ${receiverLabel(pin.receiverId)} at ${formatPinTime(pin.t)}`;
}

/** Pins picked by a click are rounded to what the view can show: millimetres, tenths of a microsecond. */
export function roundPickedPin(pin: CommentPin): CommentPin {
  const t = Math.max(0, Math.round(pin.t * 1e7) / 1e7);
  if (pin.kind === "field") return { ...pin, x: Math.round(pin.x * 1000) / 1000, y: Math.round(pin.y * 1000) / 1000, t };
  return { ...pin, t, ...(pin.value !== undefined ? { value: Number(pin.value.toPrecision(4)) } : {}) };
}
