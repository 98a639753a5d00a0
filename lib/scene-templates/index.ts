// Starting points for a new scene. Every one is an invented, generic situation; each is a valid
// scene (tests/unit/scene-templates.test.ts parses them all).
import type { SceneInput } from "@/lib/fdtd/scene";

export interface SceneTemplate {
  id: string;
  title: string;
  summary: string;
  scene: SceneInput;
}

const ricker = (peakFrequency: number) => ({ kind: "ricker" as const, peakFrequency });

export const sceneTemplates: SceneTemplate[] = [
  {
    id: "roadside-barrier",
    title: "Roadside barrier section",
    summary: "A road lane, a 3 m barrier at the verge, hard ground to the barrier and grass beyond, receivers at a dwelling.",
    scene: {
      version: 1,
      name: "Roadside barrier section",
      domain: { width: 40, height: 12 },
      medium: { kind: "air", temperature: 15 },
      resolution: { kind: "frequency", maxFrequency: 400, pointsPerWavelength: 10, courantNumber: 0.6 },
      geometry: {
        solids: [],
        walls: [{ id: "barrier", label: "Barrier, 3 m", path: [{ x: 8, y: 0 }, { x: 8, y: 3 }], thickness: 0.15, surface: { kind: "rigid" } }],
        surfaces: [{ id: "grass", label: "Grass beyond the barrier", path: [{ x: 8.2, y: 0 }, { x: 40, y: 0 }], treatment: { kind: "material", material: "grass-ground" } }],
      },
      boundary: { left: { kind: "pml", layerCells: 20 }, right: { kind: "pml", layerCells: 20 }, top: { kind: "pml", layerCells: 20 }, bottom: { kind: "rigid" } },
      sources: [{ id: "lane", label: "Traffic lane", position: { x: 3, y: 0.5 }, amplitude: 0.002, signal: ricker(150) }],
      receivers: [
        { id: "garden", label: "Garden, 1.5 m", position: { x: 25, y: 1.5 } },
        { id: "upper-window", label: "Upper window, 4.5 m", position: { x: 35, y: 4.5 } },
      ],
      duration: { kind: "time", seconds: 0.18 },
    },
  },
  {
    id: "rectangular-room",
    title: "Rectangular room",
    summary: "A 6 m by 4 m room section with rigid walls and one absorptive ceiling, a loudspeaker and two listening positions.",
    scene: {
      version: 1,
      name: "Rectangular room",
      domain: { width: 6, height: 4 },
      medium: { kind: "air", temperature: 20 },
      resolution: { kind: "frequency", maxFrequency: 500, pointsPerWavelength: 12, courantNumber: 0.6 },
      geometry: { solids: [], walls: [], surfaces: [] },
      boundary: {
        left: { kind: "rigid" },
        right: { kind: "rigid" },
        bottom: { kind: "material", material: "carpet-on-concrete" },
        top: { kind: "material", material: "mineral-wool-50mm" },
      },
      sources: [{ id: "loudspeaker", label: "Loudspeaker", position: { x: 1.1, y: 1.2 }, amplitude: 0.001, signal: ricker(180) }],
      receivers: [
        { id: "seat-front", label: "Front seat", position: { x: 3.2, y: 1.2 } },
        { id: "seat-back", label: "Back seat", position: { x: 5.1, y: 1.2 } },
      ],
      duration: { kind: "decay", decayDb: 40, maxSeconds: 1.5 },
    },
  },
  {
    id: "street-canyon",
    title: "Street canyon",
    summary: "A street between two façades 14 m apart, traffic in the middle, receivers at windows up both façades.",
    scene: {
      version: 1,
      name: "Street canyon",
      domain: { width: 30, height: 20 },
      medium: { kind: "air", temperature: 15 },
      resolution: { kind: "frequency", maxFrequency: 250, pointsPerWavelength: 10, courantNumber: 0.6 },
      geometry: {
        solids: [
          { id: "block-west", label: "West block", polygon: [{ x: 0, y: 0 }, { x: 8, y: 0 }, { x: 8, y: 15 }, { x: 0, y: 15 }], surface: { kind: "material", material: "brick-unglazed" } },
          { id: "block-east", label: "East block", polygon: [{ x: 22, y: 0 }, { x: 30, y: 0 }, { x: 30, y: 12 }, { x: 22, y: 12 }], surface: { kind: "material", material: "brick-unglazed" } },
        ],
        walls: [],
        surfaces: [],
      },
      boundary: { left: { kind: "pml", layerCells: 20 }, right: { kind: "pml", layerCells: 20 }, top: { kind: "pml", layerCells: 20 }, bottom: { kind: "rigid" } },
      sources: [{ id: "traffic", label: "Traffic, street centre", position: { x: 15, y: 0.5 }, amplitude: 0.002, signal: ricker(100) }],
      receivers: [
        { id: "west-1", label: "West façade, 1st floor", position: { x: 8.5, y: 4.5 } },
        { id: "west-4", label: "West façade, 4th floor", position: { x: 8.5, y: 13.5 } },
        { id: "east-2", label: "East façade, 2nd floor", position: { x: 21.5, y: 7.5 } },
      ],
      duration: { kind: "time", seconds: 0.3 },
    },
  },
  {
    id: "wall-opening",
    title: "Opening in a wall",
    summary: "A plant room behind a wall with a 1.2 m louvre opening; how much sound gets through to the yard.",
    scene: {
      version: 1,
      name: "Opening in a wall",
      domain: { width: 16, height: 10 },
      medium: { kind: "air", temperature: 20 },
      resolution: { kind: "frequency", maxFrequency: 500, pointsPerWavelength: 10, courantNumber: 0.6 },
      geometry: {
        solids: [],
        walls: [
          { id: "wall-lower", label: "Wall below the opening", path: [{ x: 6, y: 0 }, { x: 6, y: 3.4 }], thickness: 0.25, surface: { kind: "rigid" } },
          { id: "wall-upper", label: "Wall above the opening", path: [{ x: 6, y: 4.6 }, { x: 6, y: 10 }], thickness: 0.25, surface: { kind: "rigid" } },
        ],
        surfaces: [],
      },
      boundary: { left: { kind: "rigid" }, right: { kind: "pml", layerCells: 20 }, top: { kind: "pml", layerCells: 20 }, bottom: { kind: "rigid" } },
      sources: [{ id: "fan", label: "Extract fan", position: { x: 2, y: 2 }, amplitude: 0.001, signal: ricker(200) }],
      receivers: [
        { id: "yard-near", label: "Yard, 3 m from the opening", position: { x: 9, y: 4 } },
        { id: "yard-off-axis", label: "Yard, off axis", position: { x: 10, y: 1.5 } },
      ],
      duration: { kind: "time", seconds: 0.12 },
    },
  },
];

export function findSceneTemplate(id: string): SceneTemplate | undefined {
  return sceneTemplates.find((template) => template.id === id);
}
