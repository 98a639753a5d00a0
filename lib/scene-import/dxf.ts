// DXF drawings into barriers and solids. `readDxf` lists what a drawing holds (layers, counts, extent,
// declared units); `placeDxf` turns the layers a person chose into scene geometry in metres, inside the
// domain. Only straight geometry is read: LINE, LWPOLYLINE and POLYLINE in model space.
import DxfParser, { type IDxf, type IEntity, type ILineEntity, type ILwpolylineEntity, type IPolylineEntity } from "dxf-parser";

import type { Point } from "@/lib/fdtd/scene";

import { boundsInsideDomain, boundsOf, describeBounds, describeDomain, openRing, signedDoubleArea, withoutRepeatedPoints, type Bounds, type DomainSize, type ImportResult } from "./geometry";

export type LengthUnit = "mm" | "cm" | "m" | "inch" | "foot";

export const LENGTH_UNITS: readonly LengthUnit[] = ["mm", "cm", "m", "inch", "foot"];

export const METRES_PER_UNIT: Record<LengthUnit, number> = { mm: 0.001, cm: 0.01, m: 1, inch: 0.0254, foot: 0.3048 };

export const LENGTH_UNIT_NAMES: Record<LengthUnit, string> = { mm: "millimetres", cm: "centimetres", m: "metres", inch: "inches", foot: "feet" };

/** The header variable $INSUNITS: the codes of the units this import reads. */
const INSUNITS_CODES: Record<number, LengthUnit> = { 1: "inch", 2: "foot", 4: "mm", 5: "cm", 6: "m" };

/** Names of the other $INSUNITS codes, so a person learns what the drawing claims. */
const OTHER_INSUNITS: Record<number, string> = {
  3: "miles",
  7: "kilometres",
  8: "microinches",
  9: "mils",
  10: "yards",
  11: "ångströms",
  12: "nanometres",
  13: "micrometres",
  14: "decimetres",
  15: "decametres",
  16: "hectometres",
  17: "gigametres",
  18: "astronomical units",
  19: "light years",
  20: "parsecs",
};

/** Largest DXF text read, characters: a plan of a few buildings is well under this. */
export const MAX_DXF_CHARACTERS = 30 * 1024 * 1024;

/** Most barriers and solids one import may add: beyond this the editor becomes slow to draw. */
export const MAX_IMPORTED_SHAPES = 5000;

export type DxfEntityType = "LINE" | "LWPOLYLINE" | "POLYLINE";

/** One usable entity, in the drawing's own units. A closed shape lists each corner once. */
export interface DxfShape {
  layer: string;
  type: DxfEntityType;
  points: Point[];
  closed: boolean;
}

export interface DxfLayerSummary {
  name: string;
  lines: number;
  openPolylines: number;
  closedPolylines: number;
}

export interface DxfDrawing {
  /** Layers holding usable entities, by name. */
  layers: DxfLayerSummary[];
  shapes: DxfShape[];
  /** Extent of every usable entity, in the drawing's units. */
  extent: Bounds;
  /** Units from $INSUNITS, when it names one this import reads. */
  declaredUnits: LengthUnit | null;
  /** Why the declared units cannot be used (unitless, or a unit this import does not read); null when they can. */
  unitsNote: string | null;
  /** Entities left out, by type ("ARC", "INSERT", "paper space LINE"), with counts. */
  ignored: { type: string; count: number }[];
  /** Polyline segments drawn as arcs (bulges); they are imported as straight chords. */
  arcSegments: number;
}

/** One text line pair of a DXF: the group code and its value. */
interface Group {
  code: number;
  value: string;
  /** 0-based index of the code's text line. */
  line: number;
}

const GROUP_CODE = /^-?\d+$/;

function readGroups(lines: readonly string[]): ImportResult<{ groups: Group[] }> {
  const groups: Group[] = [];
  for (let line = 0; line + 1 < lines.length; line += 2) {
    const codeText = lines[line]!.trim();
    if (!GROUP_CODE.test(codeText)) {
      if (groups.length === 0) return { ok: false, message: "This is not a DXF file: a DXF starts with a group code (0) and SECTION." };
      return { ok: false, message: `The DXF is damaged at line ${line + 1}: expected a group code (a whole number), found “${codeText.slice(0, 40)}”.` };
    }
    groups.push({ code: Number(codeText), value: lines[line + 1]!.trim(), line });
  }
  return { ok: true, groups };
}

/** Lines [start, end] of a section, from its `0 SECTION` to its `0 ENDSEC`. */
interface SectionSpan {
  start: number;
  end: number;
}

/**
 * Finds the HEADER and ENTITIES sections and checks the one structure the parser cannot survive: a
 * POLYLINE whose VERTEX records are not closed by SEQEND makes its vertex loop spin for ever.
 */
function findSections(groups: readonly Group[]): ImportResult<{ header: SectionSpan | null; entities: SectionSpan }> {
  const first = groups.find((g) => g.code !== 999);
  if (!first || first.code !== 0 || first.value !== "SECTION") {
    return { ok: false, message: "This is not a DXF file: a DXF starts with a group code (0) and SECTION." };
  }
  let header: SectionSpan | null = null;
  let entities: SectionSpan | null = null;
  let k = 0;
  while (k < groups.length) {
    const group = groups[k]!;
    if (group.code === 0 && group.value === "EOF") break;
    if (!(group.code === 0 && group.value === "SECTION")) {
      k++;
      continue;
    }
    const name = groups[k + 1];
    if (!name || name.code !== 2) return { ok: false, message: `The DXF is damaged at line ${group.line + 1}: a SECTION without a name.` };
    let end = k + 2;
    let openPolyline: Group | null = null;
    let layerOfPolyline = "";
    for (; end < groups.length; end++) {
      const inner = groups[end]!;
      if (name.value === "ENTITIES" && openPolyline && inner.code === 8 && layerOfPolyline === "") layerOfPolyline = inner.value;
      if (inner.code !== 0) continue;
      if (inner.value === "ENDSEC") break;
      if (name.value !== "ENTITIES") continue;
      if (openPolyline) {
        if (inner.value === "VERTEX") continue;
        if (inner.value === "SEQEND") {
          openPolyline = null;
          continue;
        }
        return { ok: false, message: `The DXF is damaged: the POLYLINE at line ${openPolyline.line + 1}${layerOfPolyline ? ` (layer “${layerOfPolyline}”)` : ""} has no SEQEND before the next entity.` };
      }
      if (inner.value === "POLYLINE") {
        openPolyline = inner;
        layerOfPolyline = "";
      }
    }
    if (end >= groups.length) return { ok: false, message: `The DXF ends inside its ${name.value} section: the file looks cut short.` };
    if (openPolyline) return { ok: false, message: `The DXF is damaged: the POLYLINE at line ${openPolyline.line + 1} has no SEQEND before the end of the section.` };
    const span = { start: group.line, end: groups[end]!.line + 1 };
    if (name.value === "HEADER") header = span;
    if (name.value === "ENTITIES") entities = span;
    k = end + 1;
  }
  if (!entities) return { ok: false, message: "The DXF has no ENTITIES section: there is no drawing to import." };
  return { ok: true, header, entities };
}

function unitsFromHeader(header: Record<string, unknown> | undefined): { declaredUnits: LengthUnit | null; unitsNote: string | null } {
  const code = header?.["$INSUNITS"];
  if (typeof code !== "number" || code === 0) {
    return { declaredUnits: null, unitsNote: "The drawing does not state its units." };
  }
  const unit = INSUNITS_CODES[code];
  if (unit) return { declaredUnits: unit, unitsNote: null };
  const name = OTHER_INSUNITS[code];
  return { declaredUnits: null, unitsNote: name ? `The drawing is in ${name}, which this import does not read.` : `The drawing's unit code ${code} is not one this import knows.` };
}

/** Counts of what was left out, kept in first-seen order. */
class Tally {
  readonly counts = new Map<string, number>();
  add(type: string): void {
    this.counts.set(type, (this.counts.get(type) ?? 0) + 1);
  }
  list(): { type: string; count: number }[] {
    return [...this.counts].map(([type, count]) => ({ type, count }));
  }
}

function finitePoint(p: { x: unknown; y: unknown } | undefined): Point | null {
  if (!p || typeof p.x !== "number" || typeof p.y !== "number" || !Number.isFinite(p.x) || !Number.isFinite(p.y)) return null;
  return { x: p.x, y: p.y };
}

/** Points of a polyline, or null when a coordinate is missing or not a number (a damaged entity). */
function finitePoints(vertices: readonly ({ x: unknown; y: unknown } | undefined)[]): Point[] | null {
  const points: Point[] = [];
  for (const vertex of vertices) {
    const p = finitePoint(vertex);
    if (!p) return null;
    points.push(p);
  }
  return points;
}

/**
 * A shape from an entity's points. A polyline counts as closed when its flag says so or when it ends
 * where it starts (many programs close outlines that way); a closed shape needs three distinct corners.
 */
function shapeFrom(layer: string, type: DxfEntityType, points: readonly Point[], closedFlag: boolean): DxfShape | null {
  const distinct = withoutRepeatedPoints(points);
  const ring = openRing(points);
  const endsWhereItStarts = type !== "LINE" && distinct.length >= 4 && ring.length === distinct.length - 1;
  if ((closedFlag || endsWhereItStarts) && ring.length >= 3) return { layer, type, points: ring, closed: true };
  if (distinct.length < 2) return null;
  return { layer, type, points: distinct, closed: false };
}

type EntityOutcome = { shape: DxfShape; arcSegments: number } | { ignored: string } | { damaged: string };

function readEntity(entity: IEntity): EntityOutcome {
  const layer = entity.layer ?? "0";
  if (entity.inPaperSpace) return { ignored: `paper space ${entity.type}` };
  switch (entity.type) {
    case "LINE": {
      const points = finitePoints((entity as ILineEntity).vertices ?? []);
      if (!points || points.length !== 2) return { damaged: `a LINE on layer “${layer}” has no valid end points` };
      const shape = shapeFrom(layer, "LINE", points, false);
      return shape ? { shape, arcSegments: 0 } : { ignored: "zero-length LINE" };
    }
    case "LWPOLYLINE": {
      const polyline = entity as ILwpolylineEntity;
      const points = finitePoints(polyline.vertices ?? []);
      if (!points) return { damaged: `an LWPOLYLINE on layer “${layer}” has a vertex without valid coordinates` };
      const shape = shapeFrom(layer, "LWPOLYLINE", points, polyline.shape === true);
      const arcSegments = (polyline.vertices ?? []).filter((v) => typeof v.bulge === "number" && v.bulge !== 0).length;
      return shape ? { shape, arcSegments } : { ignored: "LWPOLYLINE of one point" };
    }
    case "POLYLINE": {
      const polyline = entity as IPolylineEntity;
      if (polyline.is3dPolygonMesh || polyline.isPolyfaceMesh) return { ignored: "POLYLINE mesh" };
      // A spline-fitted polyline lists its control points too; the curve passes through the others.
      const vertices = (polyline.vertices ?? []).filter((v) => !v.splineControlPoint);
      const points = finitePoints(vertices);
      if (!points) return { damaged: `a POLYLINE on layer “${layer}” has a vertex without valid coordinates` };
      const shape = shapeFrom(layer, "POLYLINE", points, polyline.shape === true);
      const arcSegments = vertices.filter((v) => typeof v.bulge === "number" && v.bulge !== 0).length;
      return shape ? { shape, arcSegments } : { ignored: "POLYLINE of one point" };
    }
    default:
      return { ignored: entity.type || "unnamed entity" };
  }
}

function summariseLayers(shapes: readonly DxfShape[]): DxfLayerSummary[] {
  const layers = new Map<string, DxfLayerSummary>();
  for (const shape of shapes) {
    let layer = layers.get(shape.layer);
    if (!layer) {
      layer = { name: shape.layer, lines: 0, openPolylines: 0, closedPolylines: 0 };
      layers.set(shape.layer, layer);
    }
    if (shape.type === "LINE") layer.lines++;
    else if (shape.closed) layer.closedPolylines++;
    else layer.openPolylines++;
  }
  return [...layers.values()].sort((a, b) => a.name.localeCompare(b.name, "en", { numeric: true }));
}

/** Reads a DXF text and lists its usable geometry. Never throws: a bad file gives a message. */
export function readDxf(text: string): ImportResult<{ drawing: DxfDrawing }> {
  if (text.length > MAX_DXF_CHARACTERS) {
    return { ok: false, message: `The DXF is ${(text.length / 1048576).toFixed(1)} MB; at most ${MAX_DXF_CHARACTERS / 1048576} MB are read. Remove what is not needed (other layers, blocks) and export again.` };
  }
  if (text.trim() === "") return { ok: false, message: "The file is empty." };
  if (text.startsWith("AutoCAD Binary DXF")) return { ok: false, message: "This is a binary DXF; save the drawing as an ASCII DXF and import that." };
  const lines = text.split(/\r\n|\r|\n/);
  const read = readGroups(lines);
  if (!read.ok) return read;
  const sections = findSections(read.groups);
  if (!sections.ok) return sections;

  // Only the header and the entities are needed. Handing the parser just those keeps a damaged table
  // or block, which this import does not use, from stalling it (its table loops can spin on bad records).
  const header = sections.header ? lines.slice(sections.header.start, sections.header.end + 1) : [];
  const entities = lines.slice(sections.entities.start, sections.entities.end + 1);
  let parsed: IDxf | null;
  try {
    parsed = new DxfParser().parseSync([...header, ...entities, "0", "EOF"].join("\n"));
  } catch (error) {
    return { ok: false, message: `The DXF could not be read: ${error instanceof Error ? error.message : String(error)}.` };
  }
  if (!parsed) return { ok: false, message: "The DXF could not be read." };

  const shapes: DxfShape[] = [];
  const ignored = new Tally();
  let arcSegments = 0;
  for (const entity of parsed.entities ?? []) {
    const outcome = readEntity(entity);
    if ("damaged" in outcome) return { ok: false, message: `The DXF is damaged: ${outcome.damaged}.` };
    if ("ignored" in outcome) {
      ignored.add(outcome.ignored);
      continue;
    }
    shapes.push(outcome.shape);
    arcSegments += outcome.arcSegments;
  }
  const extent = boundsOf(shapes.map((shape) => shape.points));
  if (!extent) {
    const found = ignored.list();
    const what = found.length > 0 ? ` It holds only ${found.map((entry) => `${entry.count} ${entry.type}`).join(", ")}.` : "";
    return { ok: false, message: `The DXF has no lines or polylines in model space to import.${what}` };
  }
  return {
    ok: true,
    drawing: { layers: summariseLayers(shapes), shapes, extent, ...unitsFromHeader(parsed.header as Record<string, unknown> | undefined), ignored: ignored.list(), arcSegments },
  };
}

// ---------------------------------------------------------------------------------------------
// Placing the chosen layers in the scene

export interface DxfPlacement {
  /** Layers whose lines and polylines become barriers (thin walls along them). */
  wallLayers: readonly string[];
  /** Layers whose closed polylines become solids. A layer in both lists gives solids from its closed polylines and barriers from the rest. */
  solidLayers: readonly string[];
  /** The drawing's units; when absent, the units its header declares. */
  units?: LengthUnit | null;
  /** Metres added to every point after conversion, to move the drawing into the domain. */
  offset?: Point;
  /** Thickness of every barrier, m. */
  wallThickness: number;
}

export interface PlacedDxf {
  /** Barrier centre lines, m. A closed polyline gives a path that returns to its first point. */
  walls: { path: Point[]; thickness: number }[];
  /** Solid outlines, m. */
  solids: { polygon: Point[] }[];
  /** Extent of what is placed, m, inside the domain. */
  extent: Bounds;
  /** Units used for the conversion. */
  units: LengthUnit;
  /** Lines and open polylines on layers chosen only for solids, which give nothing. */
  openShapesOnSolidLayers: number;
}

interface ChosenShapes {
  walls: Point[][];
  solids: Point[][];
  units: LengthUnit;
  openShapesOnSolidLayers: number;
}

/** The shapes of the chosen layers, in drawing units, or why the choice cannot be imported. */
function chooseShapes(drawing: DxfDrawing, placement: Omit<DxfPlacement, "offset" | "wallThickness">): ImportResult<ChosenShapes> {
  const units = placement.units ?? drawing.declaredUnits;
  if (!units) return { ok: false, message: `${drawing.unitsNote ?? "The drawing does not state its units."} Choose the units it was drawn in.` };
  if (placement.wallLayers.length === 0 && placement.solidLayers.length === 0) return { ok: false, message: "Choose at least one layer for barriers or solids." };
  const known = new Set(drawing.layers.map((layer) => layer.name));
  for (const name of [...placement.wallLayers, ...placement.solidLayers]) {
    if (!known.has(name)) return { ok: false, message: `Layer “${name}” has no lines or polylines in this drawing.` };
  }
  const solidLayers = new Set(placement.solidLayers);
  const walls: Point[][] = [];
  const solids: Point[][] = [];
  for (const name of placement.wallLayers) {
    // Closed outlines on a layer that is also chosen for solids become solids, not barriers round them.
    const onLayer = drawing.shapes.filter((shape) => shape.layer === name && !(solidLayers.has(name) && shape.closed));
    if (onLayer.length === 0) {
      return { ok: false, message: `Layer “${name}” has no ${solidLayers.has(name) ? "open lines or polylines besides its closed outlines" : "lines or polylines"} to become barriers.` };
    }
    for (const shape of onLayer) walls.push(shape.closed ? [...shape.points, shape.points[0]!] : shape.points);
  }
  let openShapesOnSolidLayers = 0;
  for (const name of placement.solidLayers) {
    const onLayer = drawing.shapes.filter((shape) => shape.layer === name);
    const outlines = onLayer.filter((shape) => shape.closed && signedDoubleArea(shape.points) !== 0);
    if (outlines.length === 0) return { ok: false, message: `Layer “${name}” has no closed polylines enclosing an area to become solids.` };
    if (!placement.wallLayers.includes(name)) openShapesOnSolidLayers += onLayer.filter((shape) => !shape.closed).length;
    for (const shape of outlines) solids.push(shape.points);
  }
  if (walls.length + solids.length > MAX_IMPORTED_SHAPES) {
    return { ok: false, message: `The chosen layers hold ${walls.length + solids.length} shapes; at most ${MAX_IMPORTED_SHAPES} are imported at once. Choose fewer layers.` };
  }
  return { ok: true, walls, solids, units, openShapesOnSolidLayers };
}

function toMetres(points: readonly Point[], metresPerUnit: number, offset: Point): Point[] {
  return points.map((p) => ({ x: p.x * metresPerUnit + offset.x, y: p.y * metresPerUnit + offset.y }));
}

/**
 * The chosen layers as barriers and solids in metres, moved by the offset. Refuses (with a message) a
 * choice that gives nothing, a thickness that is not positive, and geometry that leaves the domain.
 */
export function placeDxf(drawing: DxfDrawing, placement: DxfPlacement, domain: DomainSize): ImportResult<PlacedDxf> {
  if (!(placement.wallThickness > 0) || !Number.isFinite(placement.wallThickness)) return { ok: false, message: "The barrier thickness must be a number above 0 m." };
  const offset = placement.offset ?? { x: 0, y: 0 };
  if (!Number.isFinite(offset.x) || !Number.isFinite(offset.y)) return { ok: false, message: "The offset must be a pair of numbers in metres." };
  const chosen = chooseShapes(drawing, placement);
  if (!chosen.ok) return chosen;
  const scale = METRES_PER_UNIT[chosen.units];
  const walls = chosen.walls.map((points) => ({ path: toMetres(points, scale, offset), thickness: placement.wallThickness }));
  const solids = chosen.solids.map((points) => ({ polygon: toMetres(points, scale, offset) }));
  const extent = boundsOf([...walls.map((wall) => wall.path), ...solids.map((solid) => solid.polygon)])!;
  if (!boundsInsideDomain(extent, domain)) {
    return {
      ok: false,
      message: `In ${LENGTH_UNIT_NAMES[chosen.units]}, the chosen layers span ${describeBounds(extent, "m")}, outside the domain (${describeDomain(domain)}). Check the units, or move the drawing with the offset.`,
    };
  }
  return { ok: true, walls, solids, extent, units: chosen.units, openShapesOnSolidLayers: chosen.openShapesOnSolidLayers };
}

/**
 * The offset, m, that puts the middle of the chosen layers at the middle of the domain; null when the
 * choice cannot be placed at all (no layers, no units).
 */
export function centringOffset(drawing: DxfDrawing, placement: Omit<DxfPlacement, "offset" | "wallThickness">, domain: DomainSize): Point | null {
  const chosen = chooseShapes(drawing, placement);
  if (!chosen.ok) return null;
  const scale = METRES_PER_UNIT[chosen.units];
  const extent = boundsOf([...chosen.walls, ...chosen.solids])!;
  return {
    x: domain.width / 2 - ((extent.minX + extent.maxX) / 2) * scale,
    y: domain.height / 2 - ((extent.minY + extent.maxY) / 2) * scale,
  };
}
