// Number formats of the field view's read-out and labels.
import { describe, expect, it } from "vitest";

import { formatLevel, formatLevelDifference, formatMetres, formatMilliseconds, formatPressure, formatTick, pressureUnitFor } from "@/components/field-view/format";

describe("formats", () => {
  it("writes pressures to 3 significant figures with a fitting prefix and a true minus sign", () => {
    expect(formatPressure(-0.0123)).toBe("\u221212.3 mPa");
    expect(formatPressure(2.5)).toBe("2.50 Pa");
    expect(formatPressure(4.2e-5)).toBe("42.0 \u00b5Pa");
    expect(formatPressure(0)).toBe("0 Pa");
    expect(pressureUnitFor(0.15)).toEqual({ unit: "mPa", factor: 1e3 });
  });

  it("writes levels to 0.1 dB and a dash for silence", () => {
    expect(formatLevel(93.9794, -100)).toBe("94.0 dB");
    expect(formatLevel(-100, -100)).toBe("\u2014");
    expect(formatLevelDifference(6.0206)).toBe("+6.0 dB");
    expect(formatLevelDifference(-0.04)).toBe("0.0 dB");
    expect(formatLevelDifference(-3.21)).toBe("\u22123.2 dB");
  });

  it("writes positions, times and ticks", () => {
    expect(formatMetres(-1.234)).toBe("\u22121.23 m");
    expect(formatMilliseconds(0.04505)).toBe("45.05 ms");
    expect(formatTick(0.30000000000000004, 0.1)).toBe("0.3");
    expect(formatTick(50, 25, true)).toBe("+50");
    expect(formatTick(-1e-17, 0.5, true)).toBe("0.0");
  });
});
