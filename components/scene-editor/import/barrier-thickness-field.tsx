"use client";
// The thickness given to barriers an import draws from lines: CSV and DXF imports ask the same
// question, with the same default as drawing a barrier by hand.
import { useState } from "react";

import { NumberField } from "../inspector-fields";
import { DEFAULT_DRAWING_SETTINGS } from "../model/drawing";

/** The chosen barrier thickness in metres, starting from the drawing tools' default. */
export function useBarrierThickness() {
  return useState(DEFAULT_DRAWING_SETTINGS.wallThickness);
}

export function BarrierThicknessField({ value, onChange }: { value: number; onChange: (metres: number) => void }) {
  return (
    <NumberField
      label="Barrier thickness"
      unit="m"
      value={value}
      min={0}
      exclusiveMin
      testId="import-thickness"
      onCommit={(next) => {
        if (next === undefined) return "required";
        onChange(next);
        return null;
      }}
    />
  );
}
