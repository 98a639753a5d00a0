"use client";
// Choices for a DXF drawing: which layers become barriers and which solids, the drawing's units, the
// barrier thickness and an offset into the domain, with what the import will add.
import { useMemo, useState } from "react";

import type { Point, Scene } from "@/lib/fdtd/scene";
import { centringOffset, LENGTH_UNIT_NAMES, LENGTH_UNITS, METRES_PER_UNIT, type DxfDrawing, type LengthUnit } from "@/lib/scene-import/dxf";
import { describeBounds } from "@/lib/scene-import/geometry";

import { formatNumber, NumberField, SelectField, type Choice } from "../inspector-fields";
import { BarrierThicknessField, useBarrierThickness } from "./barrier-thickness-field";
import { planImport, type PlannedImport } from "./import-edits";
import { ImportFooter, type Refusal } from "./import-footer";

interface LayerRoles {
  walls: boolean;
  solids: boolean;
}

const UNIT_CHOICES: Choice<LengthUnit>[] = LENGTH_UNITS.map((unit) => ({ value: unit, label: LENGTH_UNIT_NAMES[unit][0]!.toUpperCase() + LENGTH_UNIT_NAMES[unit].slice(1) }));

/** "Choose…" while neither the drawing nor the person has named the units. */
const NO_UNIT = "" as const;

function ignoredNote(drawing: DxfDrawing): string | null {
  const parts = drawing.ignored.map((entry) => `${entry.count} ${entry.type}`);
  return parts.length > 0 ? `Not imported: ${parts.join(", ")}. Only lines and polylines become geometry.` : null;
}

export function DxfImportPanel({
  scene,
  drawing,
  refusal,
  onApply,
  onCancel,
}: {
  scene: Scene;
  drawing: DxfDrawing;
  refusal: Refusal | null;
  onApply: (plan: PlannedImport) => void;
  onCancel: () => void;
}) {
  const [roles, setRoles] = useState<Record<string, LayerRoles>>({});
  const [units, setUnits] = useState<LengthUnit | typeof NO_UNIT>(drawing.declaredUnits ?? NO_UNIT);
  const [wallThickness, setWallThickness] = useBarrierThickness();
  const [offset, setOffset] = useState<Point>({ x: 0, y: 0 });

  const layers = useMemo(
    () => ({
      wallLayers: drawing.layers.filter((layer) => roles[layer.name]?.walls).map((layer) => layer.name),
      solidLayers: drawing.layers.filter((layer) => roles[layer.name]?.solids).map((layer) => layer.name),
      units: units === NO_UNIT ? null : units,
    }),
    [drawing, roles, units],
  );
  const plan = useMemo(() => planImport(scene, { kind: "dxf", drawing, placement: { ...layers, offset, wallThickness } }), [scene, drawing, layers, offset, wallThickness]);
  const centred = useMemo(() => centringOffset(drawing, layers, scene.domain), [drawing, layers, scene.domain]);

  const setRole = (layer: string, role: keyof LayerRoles, on: boolean) =>
    setRoles((current) => ({ ...current, [layer]: { walls: false, solids: false, ...current[layer], [role]: on } }));

  const scale = units === NO_UNIT ? null : METRES_PER_UNIT[units];
  const extentInMetres =
    scale === null
      ? null
      : {
          minX: drawing.extent.minX * scale + offset.x,
          minY: drawing.extent.minY * scale + offset.y,
          maxX: drawing.extent.maxX * scale + offset.x,
          maxY: drawing.extent.maxY * scale + offset.y,
        };
  const unitChoices: Choice<LengthUnit | typeof NO_UNIT>[] = units === NO_UNIT ? [{ value: NO_UNIT, label: "Choose the units…" }, ...UNIT_CHOICES] : UNIT_CHOICES;
  const openOnSolidLayers = drawing.layers.filter((layer) => roles[layer.name]?.solids && !roles[layer.name]?.walls).reduce((sum, layer) => sum + layer.lines + layer.openPolylines, 0);
  const notes = [
    ignoredNote(drawing),
    drawing.arcSegments > 0 ? `${drawing.arcSegments} arc segment${drawing.arcSegments === 1 ? " is" : "s are"} imported as straight lines.` : null,
    openOnSolidLayers > 0 ? `${openOnSolidLayers} open line${openOnSolidLayers === 1 ? "" : "s"} on solid-only layers give nothing; tick “Barriers” to keep them.` : null,
  ].filter((note): note is string => note !== null);

  return (
    <div className="flex flex-col gap-4" data-testid="import-dxf">
      <table className="w-full border-collapse text-[12.5px]">
        <thead>
          <tr className="border-b border-rule text-left text-[11px] uppercase tracking-[0.06em] text-muted">
            <th className="py-1.5 pr-2 font-semibold">Layer</th>
            <th className="py-1.5 pr-2 text-right font-semibold">Lines</th>
            <th className="py-1.5 pr-2 text-right font-semibold">Open</th>
            <th className="py-1.5 pr-3 text-right font-semibold">Closed</th>
            <th className="py-1.5 pr-2 text-center font-semibold">Barriers</th>
            <th className="py-1.5 text-center font-semibold">Solids</th>
          </tr>
        </thead>
        <tbody>
          {drawing.layers.map((layer) => (
            <tr key={layer.name} className="border-b border-rule/60" data-testid={`import-layer-${layer.name}`}>
              <td className="max-w-[12rem] truncate py-1.5 pr-2 font-mono text-[12px] text-ink" title={layer.name}>
                {layer.name}
              </td>
              <td className="py-1.5 pr-2 text-right font-mono tabular text-ink-soft">{layer.lines}</td>
              <td className="py-1.5 pr-2 text-right font-mono tabular text-ink-soft">{layer.openPolylines}</td>
              <td className="py-1.5 pr-3 text-right font-mono tabular text-ink-soft">{layer.closedPolylines}</td>
              <td className="py-1.5 pr-2 text-center">
                <input
                  type="checkbox"
                  className="size-4 accent-tide-600"
                  aria-label={`Layer ${layer.name} as barriers`}
                  checked={roles[layer.name]?.walls ?? false}
                  onChange={(event) => setRole(layer.name, "walls", event.target.checked)}
                />
              </td>
              <td className="py-1.5 text-center">
                <input
                  type="checkbox"
                  className="size-4 accent-tide-600 disabled:opacity-30"
                  aria-label={`Layer ${layer.name} as solids`}
                  title={layer.closedPolylines === 0 ? "No closed polylines on this layer" : undefined}
                  disabled={layer.closedPolylines === 0}
                  checked={roles[layer.name]?.solids ?? false}
                  onChange={(event) => setRole(layer.name, "solids", event.target.checked)}
                />
              </td>
            </tr>
          ))}
        </tbody>
      </table>

      <div className="grid grid-cols-2 gap-3">
        <SelectField
          label="Drawing units"
          value={units}
          choices={unitChoices}
          testId="import-units"
          onChange={setUnits}
          hint={drawing.declaredUnits ? `The drawing says ${LENGTH_UNIT_NAMES[drawing.declaredUnits]}.` : (drawing.unitsNote ?? undefined)}
        />
        <BarrierThicknessField value={wallThickness} onChange={setWallThickness} />
      </div>

      <div className="flex flex-col gap-2">
        <div className="grid grid-cols-[1fr_1fr_auto] items-end gap-3">
          <NumberField
            label="Move right by"
            unit="m"
            value={offset.x}
            testId="import-offset-x"
            onCommit={(x) => {
              if (x === undefined) return "required";
              setOffset((current) => ({ ...current, x }));
              return null;
            }}
          />
          <NumberField
            label="Move up by"
            unit="m"
            value={offset.y}
            testId="import-offset-y"
            onCommit={(y) => {
              if (y === undefined) return "required";
              setOffset((current) => ({ ...current, y }));
              return null;
            }}
          />
          <button
            type="button"
            disabled={centred === null}
            onClick={() => centred && setOffset({ x: Number(centred.x.toPrecision(9)), y: Number(centred.y.toPrecision(9)) })}
            className="h-8 rounded-md border border-rule-strong px-2.5 text-[12.5px] font-medium text-ink-soft hover:border-ink-soft hover:text-ink disabled:cursor-not-allowed disabled:opacity-40"
            title="Put the middle of the chosen layers at the middle of the domain"
          >
            Centre
          </button>
        </div>
        <p className="text-[11.5px] leading-snug text-muted">
          {extentInMetres ? (
            <>
              Whole drawing: <span className="font-mono text-ink-soft">{describeBounds(extentInMetres, "m")}</span>; domain {formatNumber(scene.domain.width)} × {formatNumber(scene.domain.height)} m.
            </>
          ) : (
            <>Whole drawing: {describeBounds(drawing.extent, "drawing units")}.</>
          )}
        </p>
      </div>

      {notes.length > 0 ? (
        <ul className="flex list-disc flex-col gap-1 pl-5 text-[11.5px] leading-snug text-muted">
          {notes.map((note) => (
            <li key={note}>{note}</li>
          ))}
        </ul>
      ) : null}

      <ImportFooter plan={plan} refusal={refusal} onApply={onApply} onCancel={onCancel} />
    </div>
  );
}
