"use client";
// How a face treats sound: rigid, a material from the table, an explicit normal-incidence absorption
// coefficient, or a real normalised impedance; and, for the outer boundary, a PML. Switching between
// them carries the acoustic value over (absorption <-> impedance), so a choice never resets the number.
import type { Edge, SurfaceTreatment } from "@/lib/fdtd/scene";
import { absorptionFromImpedance, MATERIAL_IDS, MATERIALS, reflectionFromImpedance, type MaterialId } from "@/lib/fdtd/materials";
import { treatmentImpedance } from "@/lib/fdtd/rasterise";
import { DEFAULT_PML_CELLS } from "@/lib/fdtd/scene";

import { formatNumber, NumberField, Readout, SelectField, type Choice, type Commit } from "./inspector-fields";

type TreatmentKind = SurfaceTreatment["kind"];
type EdgeKind = Edge["kind"];

const TREATMENT_CHOICES: Choice<TreatmentKind>[] = [
  { value: "rigid", label: "Rigid (reflects all)" },
  { value: "material", label: "Material from the table" },
  { value: "absorption", label: "Absorption coefficient α" },
  { value: "impedance", label: "Normalised impedance z" },
];

const MATERIAL_CHOICES: Choice<MaterialId>[] = MATERIAL_IDS.map((id) => ({ value: id, label: `${MATERIALS[id].label} · α ${MATERIALS[id].absorption}` }));

// The solver's own conversion (lib/fdtd/rasterise), so the inspector shows exactly what the grid will use.
export { treatmentImpedance };

/** The treatment of `kind` closest in effect to `current`. */
export function convertTreatment(current: SurfaceTreatment, kind: TreatmentKind): SurfaceTreatment {
  const z = treatmentImpedance(current);
  const alpha = absorptionFromImpedance(z);
  switch (kind) {
    case "rigid":
      return { kind: "rigid" };
    case "absorption":
      return { kind: "absorption", absorptionCoefficient: Number(alpha.toPrecision(3)) };
    case "impedance":
      // A rigid face has no finite impedance; 50 reflects 96% of the energy at normal incidence.
      return { kind: "impedance", normalisedImpedance: Number.isFinite(z) ? Number(z.toPrecision(4)) : 50 };
    case "material": {
      // The table entry nearest in absorption.
      let best: MaterialId = MATERIAL_IDS[0];
      for (const id of MATERIAL_IDS) if (Math.abs(MATERIALS[id].absorption - alpha) < Math.abs(MATERIALS[best].absorption - alpha)) best = id;
      return { kind: "material", material: best };
    }
  }
}

function AcousticReadout({ treatment }: { treatment: SurfaceTreatment }) {
  const z = treatmentImpedance(treatment);
  const r = reflectionFromImpedance(z);
  return (
    <div className="flex flex-col gap-1 rounded-md bg-paper px-2.5 py-2">
      <Readout label="Absorption α (normal incidence)" value={formatNumber(Number(absorptionFromImpedance(z).toFixed(3)))} />
      <Readout label="Impedance z = Z/ρc" value={Number.isFinite(z) ? formatNumber(Number(z.toPrecision(4))) : "∞"} />
      <Readout label="Pressure reflection R" value={formatNumber(Number(r.toFixed(3)))} />
    </div>
  );
}

/** The fields for one treatment; `label` names what is treated ("Faces", "Lining"). */
export function TreatmentEditor({ label, value, onCommit, testId }: { label: string; value: SurfaceTreatment; onCommit: Commit<SurfaceTreatment>; testId?: string }) {
  return (
    <div className="flex flex-col gap-3">
      <SelectField label={label} value={value.kind} choices={TREATMENT_CHOICES} testId={testId} onChange={(kind) => onCommit(convertTreatment(value, kind))} />
      <TreatmentValueFields value={value} onCommit={onCommit} />
      {value.kind !== "rigid" ? <AcousticReadout treatment={value} /> : null}
    </div>
  );
}

function TreatmentValueFields({ value, onCommit }: { value: SurfaceTreatment; onCommit: Commit<SurfaceTreatment> }) {
  if (value.kind === "material") {
    const material = MATERIALS[value.material];
    return (
      <SelectField
        label="Material"
        value={value.material}
        choices={MATERIAL_CHOICES}
        onChange={(material) => onCommit({ kind: "material", material })}
        hint={<span title={material.source}>One mid-frequency value, used at every frequency.</span>}
      />
    );
  }
  if (value.kind === "absorption") {
    return (
      <NumberField
        label="Absorption coefficient α"
        value={value.absorptionCoefficient}
        min={0}
        max={1}
        hint="α = 1 − R², normal incidence; taken as z ≥ 1."
        onCommit={(alpha) => (alpha === undefined ? "required" : onCommit({ kind: "absorption", absorptionCoefficient: alpha }))}
      />
    );
  }
  if (value.kind === "impedance") {
    return (
      <NumberField
        label="Normalised impedance z"
        value={value.normalisedImpedance}
        min={0}
        exclusiveMin
        hint="Real, locally reacting; z = 1 absorbs fully at normal incidence."
        onCommit={(z) => (z === undefined ? "required" : onCommit({ kind: "impedance", normalisedImpedance: z }))}
      />
    );
  }
  return null;
}

const EDGE_CHOICES: Choice<EdgeKind>[] = [{ value: "pml", label: "PML (open, absorbing layer)" }, ...TREATMENT_CHOICES];

/** One side of the outer boundary: a PML of some thickness, or a treated face. */
export function EdgeEditor({ side, value, cellSize, onCommit }: { side: string; value: Edge; cellSize: number; onCommit: Commit<Edge> }) {
  const changeKind = (kind: EdgeKind) => {
    if (kind === value.kind) return null;
    if (kind === "pml") return onCommit({ kind: "pml", layerCells: DEFAULT_PML_CELLS });
    return onCommit(value.kind === "pml" ? convertTreatment({ kind: "rigid" }, kind) : convertTreatment(value, kind));
  };
  return (
    <div className="flex flex-col gap-2.5 rounded-md border border-rule px-3 py-3" data-testid={`edge-${side}`}>
      <SelectField label={side[0]!.toUpperCase() + side.slice(1)} value={value.kind} choices={EDGE_CHOICES} onChange={changeKind} />
      {value.kind === "pml" ? (
        <NumberField
          label="PML thickness"
          unit="cells"
          value={value.layerCells}
          integer
          min={4}
          max={200}
          hint={`${formatNumber(Number((value.layerCells * cellSize).toPrecision(3)))} m at the current cell size; 10 or more is common practice.`}
          onCommit={(cells) => (cells === undefined ? "required" : onCommit({ kind: "pml", layerCells: cells }))}
        />
      ) : (
        <>
          <TreatmentValueFields value={value} onCommit={onCommit} />
        </>
      )}
    </div>
  );
}
