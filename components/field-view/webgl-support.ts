// Whether this browser gives WebGL, as a tiny external store for useSyncExternalStore: probed once on
// first use, and set to "unavailable" when creating a renderer fails later (e.g. the driver refuses the
// shaders), so every field view switches to its 2D fallback and says so.

type Support = "unknown" | "available" | "unavailable";

let support: Support = "unknown";
const listeners = new Set<() => void>();

function probe(): Support {
  if (typeof document === "undefined") return "unknown";
  const canvas = document.createElement("canvas");
  const gl = canvas.getContext("webgl");
  if (!gl) return "unavailable";
  // Give the probe's context back at once: browsers allow only a handful of live contexts.
  gl.getExtension("WEBGL_lose_context")?.loseContext();
  return "available";
}

/** True when WebGL can be used (or, on the server, when that is not known yet). */
export function isWebGlAvailable(): boolean {
  if (support === "unknown") support = probe();
  return support !== "unavailable";
}

/** The server cannot know; it renders the WebGL canvas and the client corrects it on hydration. */
export function isWebGlAvailableOnServer(): boolean {
  return true;
}

export function subscribeWebGlSupport(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Records that WebGL failed after all; every subscribed view re-renders with the fallback. */
export function reportWebGlUnavailable(): void {
  if (support === "unavailable") return;
  support = "unavailable";
  for (const listener of listeners) listener();
}
