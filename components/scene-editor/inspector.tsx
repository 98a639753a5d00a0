"use client";
// The side panel that edits numerically what the canvas draws: the selected entity, or with nothing
// selected the scene's settings.
import type { GridPlan } from "@/lib/fdtd/grid";
import type { Scene } from "@/lib/fdtd/scene";

import type { Selection } from "./model/editor-state";
import type { EntityRef } from "./model/entities";
import { EntityInspector } from "./inspector-entity";
import { SceneInspector } from "./inspector-scene";

export interface InspectorProps {
  scene: Scene;
  grid: GridPlan;
  selection: Selection | null;
  readOnly: boolean;
  /** Applies a new scene if it is valid; returns the reason it is not, or null. */
  tryApply: (scene: Scene, select?: Selection | null) => string | null;
  onSelect: (selection: Selection | null) => void;
  onDelete: (ref: EntityRef) => void;
  onDuplicate: (ref: EntityRef) => void;
}

export function Inspector({ scene, grid, selection, readOnly, tryApply, onSelect, onDelete, onDuplicate }: InspectorProps) {
  return (
    <div aria-label="Inspector" role="region" data-testid="inspector" className="flex min-h-0 flex-col">
      {selection ? (
        <>
          <div className="flex items-center justify-between border-b border-rule px-4 py-2">
            <button type="button" onClick={() => onSelect(null)} className="text-[12.5px] font-medium text-tide-700 hover:underline">
              ← Scene settings
            </button>
          </div>
          {/* Keyed by entity so that fields never carry a draft from one entity to another. */}
          <EntityInspector
            key={`${selection.ref.kind}:${selection.ref.id}`}
            scene={scene}
            grid={grid}
            selection={selection}
            tryApply={tryApply}
            onSelect={onSelect}
            onDelete={onDelete}
            onDuplicate={onDuplicate}
            readOnly={readOnly}
          />
        </>
      ) : (
        <SceneInspector scene={scene} grid={grid} tryApply={(next) => tryApply(next)} readOnly={readOnly} />
      )}
    </div>
  );
}
