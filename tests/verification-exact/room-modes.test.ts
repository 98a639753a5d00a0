// Rigid rectangular room modes (2D): hand-calculated frequencies, degeneracy, the mode shapes themselves,
// and the asymptotic mode count.
import { describe, expect, it } from "vitest";

import { groupDegenerateModes, rigidRoomModes, roomModeFrequency } from "@/lib/verification/exact/room-modes";

const SOUND_SPEED = 343;

describe("rigid rectangular room modes", () => {
  it("lists the lowest modes of a 5 m x 4 m room in ascending order (hand calculation)", () => {
    // f = (c/2) sqrt((m/5)^2 + (n/4)^2) by hand: (1,0) 34.3, (0,1) 42.875, (1,1) 54.9068, (2,0) 68.6,
    // (2,1) 80.8964, (0,2) 85.75, (1,2) 92.3556 Hz.
    const modes = rigidRoomModes(5, 4, SOUND_SPEED, 7);
    expect(modes.map((mode) => [mode.orderX, mode.orderY])).toEqual([[1, 0], [0, 1], [1, 1], [2, 0], [2, 1], [0, 2], [1, 2]]);
    const expected = [34.3, 42.875, 54.9068, 68.6, 80.8964, 85.75, 92.3556];
    modes.forEach((mode, index) => expect(mode.frequency).toBeCloseTo(expected[index] ?? 0, 3));
  });

  it("keeps degenerate modes of a square room with their multiplicity", () => {
    // Square 5 m room: (1,0) and (0,1) coincide; (3,4), (4,3), (5,0), (0,5) all have m^2 + n^2 = 25.
    const groups = groupDegenerateModes(rigidRoomModes(5, 5, SOUND_SPEED, 40));
    expect(groups[0]?.multiplicity).toBe(2);
    expect(groups[0]?.frequency).toBeCloseTo(34.3, 10);
    expect(groups[1]?.multiplicity).toBe(1); // (1,1)
    const fourfold = groups.find((group) => Math.abs(group.frequency - 0.5 * SOUND_SPEED) < 1e-9);
    expect(fourfold?.multiplicity).toBe(4);
    expect(fourfold?.modes.map((mode) => [mode.orderX, mode.orderY])).toEqual([[0, 5], [3, 4], [4, 3], [5, 0]]);
  });

  it("gives frequencies whose cosine shapes solve the Helmholtz equation with rigid walls", () => {
    // p = cos(m pi x/Lx) cos(n pi y/Ly) must satisfy lap p + (2 pi f/c)^2 p = 0 and dp/dn = 0 on the walls
    // (Rayleigh, Theory of Sound, vol. 2, section 267). Checked by central differences (h = 1e-4 m).
    const lengthX = 3.7;
    const lengthY = 2.3;
    const h = 1e-4;
    for (const mode of rigidRoomModes(lengthX, lengthY, SOUND_SPEED, 12)) {
      const shape = (x: number, y: number) => Math.cos((mode.orderX * Math.PI * x) / lengthX) * Math.cos((mode.orderY * Math.PI * y) / lengthY);
      const k = (2 * Math.PI * mode.frequency) / SOUND_SPEED;
      const [x, y] = [1.234, 0.789];
      const laplacian = (shape(x + h, y) + shape(x - h, y) + shape(x, y + h) + shape(x, y - h) - 4 * shape(x, y)) / (h * h);
      expect(Math.abs(laplacian + k * k * shape(x, y))).toBeLessThan(1e-5 * k * k);
      // Normal derivative on the wall x = Lx and y = 0.
      expect(Math.abs((shape(lengthX + h, y) - shape(lengthX - h, y)) / (2 * h))).toBeLessThan(1e-9);
      expect(Math.abs((shape(x, h) - shape(x, -h)) / (2 * h))).toBeLessThan(1e-9);
    }
  });

  it("counts modes like the 2D Weyl law with its rigid-wall term", () => {
    // Modes up to f (the (0,0) mode included): N(f) ~ pi A f^2 / c^2 + P f / (2c) + 1/4, by counting lattice
    // points in a quarter ellipse plus half the points on its two axes (the 2D counterpart of the 3D count in
    // Kuttruff, Room Acoustics, ch. 3). The remainder grows slower than f: measured -0.16% at 2000 modes,
    // against +2.5% for the area term alone.
    const lengthX = 7.1;
    const lengthY = 4.3;
    const count = 2000;
    const modes = rigidRoomModes(lengthX, lengthY, SOUND_SPEED, count);
    const f = modes[count - 1]?.frequency ?? 0;
    const area = lengthX * lengthY;
    const perimeter = 2 * (lengthX + lengthY);
    const weyl = (Math.PI * area * f * f) / (SOUND_SPEED * SOUND_SPEED) + (perimeter * f) / (2 * SOUND_SPEED) + 0.25;
    expect(Math.abs((count + 1) / weyl - 1)).toBeLessThan(0.005);
    // Without the wall term the count is clearly off: the test can tell the two apart.
    const areaOnly = (Math.PI * area * f * f) / (SOUND_SPEED * SOUND_SPEED);
    expect(Math.abs((count + 1) / areaOnly - 1)).toBeGreaterThan(0.015);
  });

  it("agrees with roomModeFrequency and returns nothing for a zero count", () => {
    const modes = rigidRoomModes(6, 2.5, SOUND_SPEED, 30);
    for (const mode of modes) expect(mode.frequency).toBe(roomModeFrequency(mode.orderX, mode.orderY, 6, 2.5, SOUND_SPEED));
    for (let i = 0; i + 1 < modes.length; i++) expect(modes[i]?.frequency ?? 0).toBeLessThanOrEqual(modes[i + 1]?.frequency ?? 0);
    expect(rigidRoomModes(6, 2.5, SOUND_SPEED, 0)).toEqual([]);
  });
});
