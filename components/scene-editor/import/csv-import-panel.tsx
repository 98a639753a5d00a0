"use client";
// Choices for a coordinate table: whether its rows become one barrier, one solid or a set of
// receivers, and a barrier's thickness, with what the import will add.
import { useMemo, useState } from "react";

import type { Scene } from "@/lib/fdtd/scene";
import type { CsvTarget } from "@/lib/scene-import/csv";

import { SegmentedChoice, type Choice } from "../inspector-fields";
import { BarrierThicknessField, useBarrierThickness } from "./barrier-thickness-field";
import { planImport, type PlannedImport } from "./import-edits";
import { ImportFooter, type Refusal } from "./import-footer";

const TARGET_CHOICES: Choice<CsvTarget>[] = [
  { value: "wall", label: "A barrier" },
  { value: "solid", label: "A solid" },
  { value: "receivers", label: "Receivers" },
];

const TARGET_HINTS: Record<CsvTarget, string> = {
  wall: "The rows, in order, are the barrier's centre line.",
  solid: "The rows, in order, are the corners of its outline; repeating the first corner at the end is fine.",
  receivers: "One receiver per row, named from a name or label column when there is one.",
};

export function CsvImportPanel({ scene, text, refusal, onApply, onCancel }: { scene: Scene; text: string; refusal: Refusal | null; onApply: (plan: PlannedImport) => void; onCancel: () => void }) {
  const [target, setTarget] = useState<CsvTarget>("wall");
  const [wallThickness, setWallThickness] = useBarrierThickness();
  const plan = useMemo(() => planImport(scene, { kind: "csv", text, target, wallThickness }), [scene, text, target, wallThickness]);

  return (
    <div className="flex flex-col gap-4" data-testid="import-csv">
      <SegmentedChoice label="The rows become" value={target} choices={TARGET_CHOICES} onChange={setTarget} />
      <p className="-mt-2 text-[11.5px] leading-snug text-muted">
        {TARGET_HINTS[target]} Columns x and y in metres from the domain&apos;s lower-left corner; a header row is optional.
      </p>
      {target === "wall" ? (
        <div className="w-40">
          <BarrierThicknessField value={wallThickness} onChange={setWallThickness} />
        </div>
      ) : null}
      <ImportFooter plan={plan} refusal={refusal} onApply={onApply} onCancel={onCancel} />
    </div>
  );
}
