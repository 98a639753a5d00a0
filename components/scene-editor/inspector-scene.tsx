"use client";
// The inspector with nothing selected: the scene's own settings. Domain, propagation medium, grid
// resolution, the outer boundary side by side, run duration, what the run keeps, and losses.
import type { GridPlan } from "@/lib/fdtd/grid";
import { densityOfAir, speedOfSoundInAir } from "@/lib/fdtd/medium";
import { COURANT_LIMIT_2D, DEFAULT_COURANT_NUMBER, DEFAULT_POINTS_PER_WAVELENGTH, type Scene } from "@/lib/fdtd/scene";

import { renameScene, setAttenuation, setDomain, setDuration, setEdge, setMedium, setOutput, setResolution } from "./model/scene-edits";
import { CheckboxField, formatNumber, NumberField, Readout, Section, SegmentedChoice, TextInputField } from "./inspector-fields";
import { EdgeEditor } from "./treatment-editor";

export interface SceneInspectorProps {
  scene: Scene;
  grid: GridPlan;
  tryApply: (scene: Scene) => string | null;
  readOnly: boolean;
}

const significant = (value: number, digits = 4) => formatNumber(Number(value.toPrecision(digits)));
const required = (commit: (value: number) => string | null) => (value: number | undefined) => (value === undefined ? "required" : commit(value));

export function SceneInspector({ scene, grid, tryApply, readOnly }: SceneInspectorProps) {
  const { domain, medium, resolution, duration, output } = scene;
  return (
    <fieldset disabled={readOnly} className="min-w-0">
      <div className="px-4 pb-2 pt-4">
        <p className="text-[11px] font-semibold uppercase tracking-[0.08em] text-tide-700">Scene settings</p>
        <p className="mt-0.5 text-[12.5px] text-muted">Select something on the canvas to edit it.</p>
      </div>
      <Section title="Scene">
        <TextInputField label="Name" value={scene.name} testId="scene-name" onCommit={(name) => tryApply(renameScene(scene, name))} />
      </Section>

      <Section title="Domain">
        <div className="grid grid-cols-2 gap-2">
          <NumberField label="Width" unit="m" value={domain.width} min={0} exclusiveMin testId="domain-width" onCommit={required((width) => tryApply(setDomain(scene, width, domain.height)))} />
          <NumberField label="Height" unit="m" value={domain.height} min={0} exclusiveMin testId="domain-height" onCommit={required((height) => tryApply(setDomain(scene, domain.width, height)))} />
        </div>
        <p className="text-[12px] text-muted">Origin at the bottom-left corner, x to the right, y up.</p>
      </Section>

      <Section title="Medium">
        <SegmentedChoice
          label="Propagation medium"
          value={medium.kind}
          choices={[
            { value: "air", label: "Air" },
            { value: "fluid", label: "Other fluid" },
          ]}
          onChange={(kind) => {
            if (kind === medium.kind) return;
            tryApply(setMedium(scene, kind === "air" ? { kind: "air", temperature: 20 } : { kind: "fluid", soundSpeed: grid.soundSpeed, density: grid.density }));
          }}
        />
        {medium.kind === "air" ? (
          <div className="grid grid-cols-2 gap-2">
            <NumberField label="Temperature" unit="°C" value={medium.temperature} min={-50} max={60} onCommit={required((temperature) => tryApply(setMedium(scene, { ...medium, temperature })))} />
            <NumberField
              label="Density"
              unit="kg/m³"
              value={medium.density}
              optional
              min={0}
              exclusiveMin
              max={10}
              placeholder={significant(densityOfAir(medium.temperature), 4)}
              onCommit={(density) => tryApply(setMedium(scene, density === undefined ? { kind: "air", temperature: medium.temperature } : { ...medium, density }))}
            />
          </div>
        ) : (
          <div className="grid grid-cols-2 gap-2">
            <NumberField label="Sound speed" unit="m/s" value={medium.soundSpeed} min={0} exclusiveMin max={20000} onCommit={required((soundSpeed) => tryApply(setMedium(scene, { ...medium, soundSpeed })))} />
            <NumberField label="Density" unit="kg/m³" value={medium.density} min={0} exclusiveMin max={30000} onCommit={required((density) => tryApply(setMedium(scene, { ...medium, density })))} />
          </div>
        )}
        <Readout label="Sound speed c" value={`${significant(medium.kind === "air" ? speedOfSoundInAir(medium.temperature) : medium.soundSpeed)} m/s`} />
        <Readout label="Density ρ" value={`${significant(grid.density)} kg/m³`} />
      </Section>

      <Section title="Resolution">
        <SegmentedChoice
          label="Set the grid by"
          value={resolution.kind}
          choices={[
            { value: "frequency", label: "Highest frequency" },
            { value: "cellSize", label: "Cell size" },
          ]}
          onChange={(kind) => {
            if (kind === resolution.kind) return;
            tryApply(
              setResolution(
                scene,
                kind === "cellSize"
                  ? { kind: "cellSize", cellSize: Number(grid.cellSize.toPrecision(3)), courantNumber: resolution.courantNumber }
                  : { kind: "frequency", maxFrequency: Math.round(grid.maxResolvedFrequency), pointsPerWavelength: DEFAULT_POINTS_PER_WAVELENGTH, courantNumber: resolution.courantNumber },
              ),
            );
          }}
        />
        {resolution.kind === "frequency" ? (
          <div className="grid grid-cols-2 gap-2">
            <NumberField
              label="Highest frequency"
              unit="Hz"
              value={resolution.maxFrequency}
              min={0}
              exclusiveMin
              testId="max-frequency"
              onCommit={required((maxFrequency) => tryApply(setResolution(scene, { ...resolution, maxFrequency })))}
            />
            <NumberField
              label="Cells per wavelength"
              value={resolution.pointsPerWavelength}
              min={4}
              max={200}
              hint="10 is common practice."
              onCommit={required((pointsPerWavelength) => tryApply(setResolution(scene, { ...resolution, pointsPerWavelength })))}
            />
          </div>
        ) : (
          <NumberField label="Cell size h" unit="m" value={resolution.cellSize} min={0} exclusiveMin onCommit={required((cellSize) => tryApply(setResolution(scene, { ...resolution, cellSize })))} />
        )}
        <NumberField
          label="Courant number c·dt/h"
          value={resolution.courantNumber}
          min={0}
          exclusiveMin
          max={Number(COURANT_LIMIT_2D.toFixed(4))}
          hint={`At most 1/√2 = 0.7071 in 2D; ${DEFAULT_COURANT_NUMBER} leaves a margin.`}
          onCommit={required((courantNumber) => tryApply(setResolution(scene, { ...resolution, courantNumber })))}
        />
      </Section>

      <Section title="Outer boundary">
        <div className="grid grid-cols-1 gap-2">
          {(["top", "left", "right", "bottom"] as const).map((side) => (
            <EdgeEditor key={side} side={side} value={scene.boundary[side]} cellSize={grid.cellSize} onCommit={(edge) => tryApply(setEdge(scene, side, edge))} />
          ))}
        </div>
      </Section>

      <Section title="Duration">
        <SegmentedChoice
          label="Stop"
          value={duration.kind}
          choices={[
            { value: "time", label: "After a time" },
            { value: "decay", label: "When decayed" },
          ]}
          onChange={(kind) => {
            if (kind === duration.kind) return;
            tryApply(setDuration(scene, kind === "time" ? { kind: "time", seconds: duration.kind === "decay" ? duration.maxSeconds : 0.1 } : { kind: "decay", decayDb: 60, maxSeconds: duration.kind === "time" ? duration.seconds : 1 }));
          }}
        />
        {duration.kind === "time" ? (
          <NumberField label="Simulated time" unit="s" value={duration.seconds} min={0} exclusiveMin testId="duration-seconds" onCommit={required((seconds) => tryApply(setDuration(scene, { kind: "time", seconds })))} />
        ) : (
          <div className="grid grid-cols-2 gap-2">
            <NumberField label="Energy decay" unit="dB" value={duration.decayDb} min={0} exclusiveMin max={200} onCommit={required((decayDb) => tryApply(setDuration(scene, { ...duration, decayDb })))} />
            <NumberField label="At most" unit="s" value={duration.maxSeconds} min={0} exclusiveMin onCommit={required((maxSeconds) => tryApply(setDuration(scene, { ...duration, maxSeconds })))} />
          </div>
        )}
        <Readout label="Time steps" value={grid.steps.toLocaleString("en-GB")} />
      </Section>

      <Section title="Output">
        <div className="grid grid-cols-2 gap-2">
          <NumberField
            label="Snapshot every"
            unit="steps"
            value={output.snapshotEverySteps}
            optional
            integer
            min={1}
            placeholder="none"
            onCommit={(every) => {
              const { snapshotEverySteps: _dropped, ...rest } = output;
              return tryApply(setOutput(scene, every === undefined ? rest : { ...output, snapshotEverySteps: every }));
            }}
          />
          <NumberField label="Keep every" unit="cells" value={output.snapshotCellStride} integer min={1} max={64} onCommit={required((stride) => tryApply(setOutput(scene, { ...output, snapshotCellStride: stride })))} />
        </div>
        <CheckboxField label="Level maps (running peak and RMS per cell)" checked={output.levelMaps} onChange={(levelMaps) => tryApply(setOutput(scene, { ...output, levelMaps }))} />
      </Section>

      <Section title="Losses">
        <NumberField
          label="Air attenuation"
          unit="dB/m"
          value={scene.attenuation?.dBPerMetre}
          optional
          min={0}
          max={100}
          placeholder="none"
          hint="The same at every frequency; leave empty for a lossless medium."
          onCommit={(dBPerMetre) => tryApply(setAttenuation(scene, dBPerMetre))}
        />
      </Section>
    </fieldset>
  );
}
