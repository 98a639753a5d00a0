"use client";
// The inspector for one selected entity: its name, position or points in metres, thickness, surface
// treatment, and for a source its strength and signal.
import type { GridPlan } from "@/lib/fdtd/grid";
import type { Point, Scene } from "@/lib/fdtd/scene";

import { signedDoubleArea } from "./model/drawing";
import type { Selection } from "./model/editor-state";
import { displayName, ENTITY_NAMES, entityPoints, findEntity, hasEditableVertexCount, minimumPoints, type EntityRef } from "./model/entities";
import {
  deleteVertex,
  deletionBlocker,
  insertVertex,
  moveVertex,
  setEntityLabel,
  setReceiverLineCount,
  setSourceAmplitude,
  setSourceSignal,
  setTreatment,
  setWallThickness,
} from "./model/scene-edits";
import { formatNumber, NumberField, Readout, Section, TextInputField, type Commit } from "./inspector-fields";
import { SignalEditor } from "./signal-editor";
import { TreatmentEditor } from "./treatment-editor";

export interface EntityInspectorProps {
  scene: Scene;
  grid: GridPlan;
  selection: Selection;
  /** Applies a new scene; returns why it was refused, or null. */
  tryApply: (scene: Scene, select?: Selection | null) => string | null;
  onSelect: (selection: Selection | null) => void;
  onDelete: (ref: EntityRef) => void;
  onDuplicate: (ref: EntityRef) => void;
  readOnly: boolean;
}

const metres = (value: number) => `${formatNumber(Number(value.toPrecision(4)))} m`;

function polylineLength(points: readonly Point[], closed: boolean): number {
  let length = 0;
  for (let k = 0; k + 1 < points.length; k++) length += Math.hypot(points[k + 1]!.x - points[k]!.x, points[k + 1]!.y - points[k]!.y);
  if (closed && points.length > 2) length += Math.hypot(points[0]!.x - points[points.length - 1]!.x, points[0]!.y - points[points.length - 1]!.y);
  return length;
}

/** x and y fields of one point; bounded by the domain for things that must lie in it. */
function PointFields({
  label,
  point,
  bounds,
  onCommit,
  testId,
}: {
  label?: string;
  point: Point;
  bounds?: { width: number; height: number };
  onCommit: Commit<Point>;
  testId?: string;
}) {
  return (
    <div className="grid grid-cols-2 gap-2">
      <NumberField
        label={label ? `${label} x` : "x"}
        unit="m"
        value={point.x}
        min={bounds ? 0 : undefined}
        max={bounds?.width}
        testId={testId ? `${testId}-x` : undefined}
        onCommit={(x) => (x === undefined ? "required" : onCommit({ x, y: point.y }))}
      />
      <NumberField
        label={label ? `${label} y` : "y"}
        unit="m"
        value={point.y}
        min={bounds ? 0 : undefined}
        max={bounds?.height}
        testId={testId ? `${testId}-y` : undefined}
        onCommit={(y) => (y === undefined ? "required" : onCommit({ x: point.x, y }))}
      />
    </div>
  );
}

/** The corners or vertices of a polygon or polyline, each editable, with add and remove. */
function VertexList({ scene, selection, tryApply, onSelect, closed }: { scene: Scene; selection: Selection; tryApply: EntityInspectorProps["tryApply"]; onSelect: EntityInspectorProps["onSelect"]; closed: boolean }) {
  const ref = selection.ref;
  const points = entityPoints(scene, ref);
  const canRemove = points.length > minimumPoints(ref.kind);
  const after = selection.vertex ?? points.length - 1;
  const addPoint = () => {
    // A new point halfway along the segment after the selected one (or after the last, when open).
    const a = points[after]!;
    const b = points[(after + 1) % points.length]!;
    const extendsEnd = !closed && after === points.length - 1;
    let at = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
    if (extendsEnd) {
      // Past the end of an open path: continue the last segment by half its length (1 m to the right if it has none).
      const previous = points[after - 1];
      const dx = previous ? (a.x - previous.x) / 2 : 0;
      const dy = previous ? (a.y - previous.y) / 2 : 0;
      at = dx === 0 && dy === 0 ? { x: a.x + 1, y: a.y } : { x: a.x + dx, y: a.y + dy };
    }
    tryApply(insertVertex(scene, ref, after + 1, at), { ref, vertex: after + 1 });
  };
  return (
    <div className="flex flex-col gap-1.5">
      <ol className="flex flex-col gap-1.5">
        {points.map((p, index) => {
          const active = selection.vertex === index;
          return (
            <li key={index} className={`grid grid-cols-[1.4rem_1fr_1fr_1.5rem] items-start gap-1.5 rounded-md px-1 py-1 ${active ? "bg-tide-50 ring-1 ring-tide-100" : ""}`}>
              <button
                type="button"
                onClick={() => onSelect({ ref, vertex: index })}
                className={`mt-1.5 h-6 rounded text-[11px] font-mono ${active ? "text-tide-700" : "text-muted hover:text-ink"}`}
                aria-label={`Select point ${index + 1}`}
              >
                {index + 1}
              </button>
              <NumberField label="" ariaLabel={`Point ${index + 1} x`} value={p.x} unit="m" onCommit={(x) => (x === undefined ? "required" : tryApply(moveVertex(scene, ref, index, { x, y: p.y })))} />
              <NumberField label="" ariaLabel={`Point ${index + 1} y`} value={p.y} unit="m" onCommit={(y) => (y === undefined ? "required" : tryApply(moveVertex(scene, ref, index, { x: p.x, y })))} />
              <button
                type="button"
                disabled={!canRemove}
                title={canRemove ? `Remove point ${index + 1}` : `A ${ENTITY_NAMES[ref.kind].toLowerCase()} needs at least ${minimumPoints(ref.kind)} points`}
                aria-label={`Remove point ${index + 1}`}
                onClick={() => tryApply(deleteVertex(scene, ref, index), { ref, vertex: null })}
                className="mt-1 flex size-6 items-center justify-center rounded text-muted hover:bg-signal-error-50 hover:text-signal-error disabled:opacity-30 disabled:hover:bg-transparent disabled:hover:text-muted"
              >
                <svg viewBox="0 0 16 16" className="size-3.5" aria-hidden>
                  <path d="M4 4l8 8M12 4l-8 8" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
                </svg>
              </button>
            </li>
          );
        })}
      </ol>
      <button type="button" onClick={addPoint} className="self-start rounded-md px-2 py-1 text-[12.5px] font-medium text-tide-700 hover:bg-tide-50 disabled:hidden">
        + Add a point after {selection.vertex !== null ? `point ${selection.vertex + 1}` : "the last"}
      </button>
    </div>
  );
}

/** Straight-line distance from each source: what a person checks first when placing a receiver. */
function SourceDistances({ scene, at }: { scene: Scene; at: Point }) {
  return (
    <Section title="From the sources">
      {scene.sources.map((source) => (
        <Readout key={source.id} label={displayName(source)} value={metres(Math.hypot(at.x - source.position.x, at.y - source.position.y))} />
      ))}
    </Section>
  );
}

/** Read only, the same fields are shown disabled: a reviewer reads exactly what an editor sees. */
export function EntityInspector(props: EntityInspectorProps) {
  return (
    <fieldset disabled={props.readOnly} className="min-w-0">
      <EntityFields {...props} />
    </fieldset>
  );
}

function EntityFields({ scene, grid, selection, tryApply, onSelect, onDelete, onDuplicate, readOnly }: EntityInspectorProps) {
  const ref = selection.ref;
  const entity = findEntity(scene, ref);
  if (!entity) return null;
  const blocker = deletionBlocker(scene, ref);
  const domain = scene.domain;

  const header = (
    <div className="flex flex-col gap-3 px-4 pb-4 pt-4">
      <div className="flex items-start justify-between gap-2">
        <div className="min-w-0">
          <p className="text-[11px] font-semibold uppercase tracking-[0.08em] text-tide-700">{ENTITY_NAMES[ref.kind]}</p>
          <h2 className="line-clamp-2 text-[15px] font-semibold leading-snug text-ink" title={displayName(entity)}>
            {displayName(entity)}
          </h2>
          <p className="truncate font-mono text-[11.5px] text-muted">id {entity.id}</p>
        </div>
        {!readOnly ? (
          <div className="flex shrink-0 gap-1">
            <button type="button" onClick={() => onDuplicate(ref)} className="rounded-md px-2 py-1 text-[12.5px] font-medium text-ink-soft hover:bg-ink/5">
              Duplicate
            </button>
            <button
              type="button"
              onClick={() => onDelete(ref)}
              disabled={blocker !== null}
              title={blocker ?? "Delete (Delete key)"}
              className="rounded-md px-2 py-1 text-[12.5px] font-medium text-signal-error hover:bg-signal-error-50 disabled:text-muted disabled:hover:bg-transparent"
            >
              Delete
            </button>
          </div>
        ) : null}
      </div>
      <TextInputField label="Label" value={entity.label} testId="entity-label" onCommit={(label) => tryApply(setEntityLabel(scene, ref, label))} />
    </div>
  );

  switch (ref.kind) {
    case "source": {
      const source = scene.sources.find((s) => s.id === ref.id)!;
      return (
        <div>
          {header}
          <Section title="Position">
            <PointFields point={source.position} bounds={domain} testId="source-position" onCommit={(p) => tryApply(moveVertex(scene, ref, 0, p))} />
          </Section>
          <Section title="Strength and signal">
            <NumberField
              label="Amplitude Q"
              unit="m²/s"
              value={source.amplitude}
              hint="Peak volume rate per unit length of the line source."
              onCommit={(amplitude) => (amplitude === undefined ? "required" : tryApply(setSourceAmplitude(scene, ref.id, amplitude)))}
            />
            <SignalEditor signal={source.signal} grid={grid} onCommit={(signal) => tryApply(setSourceSignal(scene, ref.id, signal))} />
          </Section>
        </div>
      );
    }
    case "receiver": {
      const receiver = scene.receivers.find((r) => r.id === ref.id)!;
      return (
        <div>
          {header}
          <Section title="Position">
            <PointFields point={receiver.position} bounds={domain} testId="receiver-position" onCommit={(p) => tryApply(moveVertex(scene, ref, 0, p))} />
          </Section>
          <SourceDistances scene={scene} at={receiver.position} />
        </div>
      );
    }
    case "receiverLine": {
      const line = scene.receiverLines.find((r) => r.id === ref.id)!;
      const length = Math.hypot(line.to.x - line.from.x, line.to.y - line.from.y);
      return (
        <div>
          {header}
          <Section title="Ends">
            <PointFields label="First" point={line.from} bounds={domain} onCommit={(p) => tryApply(moveVertex(scene, ref, 0, p))} />
            <PointFields label="Last" point={line.to} bounds={domain} onCommit={(p) => tryApply(moveVertex(scene, ref, 1, p))} />
          </Section>
          <Section title="Receivers">
            <NumberField
              label="Receivers on the line"
              value={line.count}
              integer
              min={2}
              max={10_000}
              onCommit={(count) => (count === undefined ? "required" : tryApply(setReceiverLineCount(scene, ref.id, count)))}
            />
            <Readout label="Length" value={metres(length)} />
            <Readout label="Spacing" value={metres(length / (line.count - 1))} />
          </Section>
        </div>
      );
    }
    case "wall": {
      const wall = scene.geometry.walls.find((w) => w.id === ref.id)!;
      const thin = wall.thickness < grid.cellSize;
      return (
        <div>
          {header}
          <Section title="Barrier">
            <NumberField
              label="Thickness"
              unit="m"
              value={wall.thickness}
              min={0}
              exclusiveMin
              testId="wall-thickness"
              hint={thin ? `Thinner than a cell (${formatNumber(Number(grid.cellSize.toPrecision(3)))} m): drawn as a thin screen on cell faces.` : undefined}
              onCommit={(thickness) => (thickness === undefined ? "required" : tryApply(setWallThickness(scene, ref.id, thickness)))}
            />
            <Readout label="Length along the centre line" value={metres(polylineLength(wall.path, false))} />
          </Section>
          <Section title="Surface">
            <TreatmentEditor label="Faces" value={wall.surface} testId="treatment-kind" onCommit={(treatment) => tryApply(setTreatment(scene, ref, treatment))} />
          </Section>
          <Section title="Centre line">
            <VertexList scene={scene} selection={selection} tryApply={tryApply} onSelect={onSelect} closed={false} />
          </Section>
        </div>
      );
    }
    case "solid": {
      const solid = scene.geometry.solids.find((s) => s.id === ref.id)!;
      return (
        <div>
          {header}
          <Section title="Surface">
            <TreatmentEditor label="Faces" value={solid.surface} testId="treatment-kind" onCommit={(treatment) => tryApply(setTreatment(scene, ref, treatment))} />
          </Section>
          <Section title="Outline">
            <Readout label="Area" value={`${formatNumber(Number((Math.abs(signedDoubleArea(solid.polygon)) / 2).toPrecision(4)))} m²`} />
            <Readout label="Perimeter" value={metres(polylineLength(solid.polygon, true))} />
            {hasEditableVertexCount(ref.kind) ? <VertexList scene={scene} selection={selection} tryApply={tryApply} onSelect={onSelect} closed /> : null}
          </Section>
        </div>
      );
    }
    case "surface": {
      const surface = scene.geometry.surfaces.find((s) => s.id === ref.id)!;
      return (
        <div>
          {header}
          <Section title="Treatment">
            <p className="text-[12px] leading-snug text-muted">Lines every solid, barrier or rigid outer face within one cell of the path.</p>
            <TreatmentEditor label="Lining" value={surface.treatment} testId="treatment-kind" onCommit={(treatment) => tryApply(setTreatment(scene, ref, treatment))} />
          </Section>
          <Section title="Path">
            <Readout label="Length" value={metres(polylineLength(surface.path, false))} />
            <VertexList scene={scene} selection={selection} tryApply={tryApply} onSelect={onSelect} closed={false} />
          </Section>
        </div>
      );
    }
  }
}
