// Durations for estimates and progress, rounded to what an estimate can promise.

/** "about 40 s", "about 3 min", "about 1 h 20 min"; "under a second" below one. */
export function formatEstimate(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return "unknown";
  if (seconds < 1) return "under a second";
  if (seconds < 90) return `about ${Math.round(seconds)} s`;
  const minutes = Math.round(seconds / 60);
  if (minutes < 90) return `about ${minutes} min`;
  const hours = Math.floor(minutes / 60);
  const rest = minutes - hours * 60;
  return rest === 0 ? `about ${hours} h` : `about ${hours} h ${rest} min`;
}

/** Cell updates per second in words: "41 million cell updates per second". */
export function formatRate(cellUpdatesPerSecond: number): string {
  if (cellUpdatesPerSecond >= 1e9) return `${(cellUpdatesPerSecond / 1e9).toPrecision(2)} billion cell updates per second`;
  return `${Math.round(cellUpdatesPerSecond / 1e6)} million cell updates per second`;
}
