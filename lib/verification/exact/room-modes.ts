/**
 * Normal modes of a rigid-walled rectangular room in 2D (an Lx by Ly section, the z order set to zero).
 *
 *   f_mn = (c/2) sqrt((m/Lx)^2 + (n/Ly)^2),   p_mn = cos(m pi x / Lx) cos(n pi y / Ly),   m, n >= 0
 *
 * (Rayleigh, The Theory of Sound, 1896, vol. 2, section 267; Kuttruff, Room Acoustics, ch. 3, the rigid
 * rectangular room, with n_z = 0; equation numbers not checked). Each mode shape has zero normal
 * derivative (zero normal velocity) on all four walls and solves lap p + (2 pi f / c)^2 p = 0.
 */

/** One room mode: orders along x and y and its frequency. */
export interface RoomMode {
  /** Half-wavelengths along x (m >= 0). */
  readonly orderX: number;
  /** Half-wavelengths along y (n >= 0). */
  readonly orderY: number;
  /** f_mn, Hz. */
  readonly frequency: number;
}

/** A set of modes sharing one frequency (a square room's (1,0) and (0,1), for instance). */
export interface DegenerateModeGroup {
  readonly frequency: number;
  /** Number of modes at this frequency. */
  readonly multiplicity: number;
  readonly modes: readonly RoomMode[];
}

/** f_mn in Hz for a rigid Lx by Ly room (m) and sound speed c (m/s). */
export function roomModeFrequency(orderX: number, orderY: number, lengthX: number, lengthY: number, soundSpeed: number): number {
  return 0.5 * soundSpeed * Math.hypot(orderX / lengthX, orderY / lengthY);
}

/**
 * The first `count` modes above 0 Hz (the uniform (0,0) "mode" is left out), in ascending frequency.
 * Modes with equal frequency are each listed, ordered by orderX, so degenerate modes keep their multiplicity.
 */
export function rigidRoomModes(lengthX: number, lengthY: number, soundSpeed: number, count: number): RoomMode[] {
  if (!(lengthX > 0 && lengthY > 0 && soundSpeed > 0)) throw new RangeError("room sides and sound speed must be positive");
  if (!Number.isInteger(count) || count < 0) throw new RangeError(`mode count must be a whole number, got ${count}`);
  if (count === 0) return [];
  // Grow the search radius until the count-th frequency lies inside it (then no lower mode is missed).
  let limit = (0.5 * soundSpeed * Math.sqrt(count)) / Math.min(lengthX, lengthY);
  for (;;) {
    const modes: RoomMode[] = [];
    const maxX = Math.floor((2 * limit * lengthX) / soundSpeed);
    const maxY = Math.floor((2 * limit * lengthY) / soundSpeed);
    for (let m = 0; m <= maxX; m++) {
      for (let n = 0; n <= maxY; n++) {
        if (m === 0 && n === 0) continue;
        const frequency = roomModeFrequency(m, n, lengthX, lengthY, soundSpeed);
        if (frequency <= limit) modes.push({ orderX: m, orderY: n, frequency });
      }
    }
    if (modes.length >= count) {
      modes.sort((a, b) => a.frequency - b.frequency || a.orderX - b.orderX);
      return modes.slice(0, count);
    }
    limit *= 1.5;
  }
}

/**
 * Groups consecutive modes whose frequencies agree to `relativeTolerance` (default 1e-9) into degenerate sets.
 * @param modes modes in ascending frequency, e.g. from rigidRoomModes
 */
export function groupDegenerateModes(modes: readonly RoomMode[], relativeTolerance = 1e-9): DegenerateModeGroup[] {
  const groups: DegenerateModeGroup[] = [];
  let current: RoomMode[] = [];
  for (const mode of modes) {
    const first = current[0];
    if (first && Math.abs(mode.frequency - first.frequency) > relativeTolerance * first.frequency) {
      groups.push({ frequency: first.frequency, multiplicity: current.length, modes: current });
      current = [];
    }
    current.push(mode);
  }
  const first = current[0];
  if (first) groups.push({ frequency: first.frequency, multiplicity: current.length, modes: current });
  return groups;
}
