"use client";
// Octave and one-third-octave band levels of the chosen receivers: a table and a bar chart, A-weighting and
// air absorption (ISO 9613-1, over the distance from the nearest source) as options, only the bands the grid
// resolves, and the reason for every band left out.
import { Fragment, useMemo, useRef, useState } from "react";

import { useCarefulBands } from "@/components/accuracy/careful-bands";
import { downloadBlob } from "@/components/field-view/field-view-toolbar";
import { AddChartButton } from "@/components/notebook/add-chart-block";
import { type Atmosphere, BAND_CENTRE_SIMPLIFICATION, bandAirAttenuation, molarConcentrationOfWaterVapour } from "@/lib/analysis/air-absorption";
import { bandLevelTable, type BandLevelTable, type BandsPerOctave, sumLevels } from "@/lib/analysis/band-levels";
import { bandLevelsCsv } from "@/lib/analysis/csv";
import { nearestSource } from "@/lib/analysis/source-distance";
import type { DecodedRun } from "@/lib/run-record/payload";

import { AnalysisPanel, ExportButton, Note, Segmented } from "./analysis-controls";
import { receiverColour } from "./analysis-traces";
import { BandBarChart, formatHz } from "./band-bar-chart";
import { BandTableHead, bandFileTag, ReceiverBandRow, UseWithCareLegend } from "./band-table";
import { downloadCsv, exportFileName, svgChartPng } from "./export-files";

export interface BandLevelsPanelProps {
  run: DecodedRun;
  runId: string;
  /** Given on the saved run's page: offers "Add to notebook" with the panel's choices. */
  studyId?: string;
  receiverIds: readonly string[];
  /** GridPlan.maxResolvedFrequency, Hz. */
  highestResolvedFrequency: number;
  /** Air temperature of the scene, °C: the starting value of the absorption's temperature. */
  sceneTemperature?: number;
}

interface AirInputs {
  temperature: string;
  humidity: string;
  pressureKpa: string;
}

type AirParse = { ok: true; atmosphere: Atmosphere } | { ok: false; message: string };

/** Inputs checked against the ranges ISO 9613-1 covers (from memory: -20 to 50 °C, 10 to 100 %, up to 200 kPa). */
function parseAir(inputs: AirInputs): AirParse {
  const temperature = Number(inputs.temperature);
  const humidity = Number(inputs.humidity);
  const pressureKpa = Number(inputs.pressureKpa);
  if (inputs.temperature.trim() === "" || !Number.isFinite(temperature) || temperature < -20 || temperature > 50) return { ok: false, message: "Temperature: a number from -20 to 50 °C." };
  if (inputs.humidity.trim() === "" || !Number.isFinite(humidity) || humidity < 10 || humidity > 100) return { ok: false, message: "Relative humidity: a number from 10 to 100 %." };
  if (inputs.pressureKpa.trim() === "" || !Number.isFinite(pressureKpa) || pressureKpa < 50 || pressureKpa > 200) return { ok: false, message: "Pressure: a number from 50 to 200 kPa." };
  return { ok: true, atmosphere: { temperatureCelsius: temperature, relativeHumidity: humidity, pressure: pressureKpa * 1000 } };
}

interface AirEffect {
  /** Per receiver in table order: distance, source label, attenuation per band (dB), levels after. */
  rows: { distance: number; sourceLabel: string; attenuation: Float64Array; levels: Float64Array }[];
  note: string;
}

function airEffect(table: BandLevelTable, run: DecodedRun, atmosphere: Atmosphere): AirEffect | string {
  const sources = run.header.sources.map((s) => ({ id: s.id, label: s.label || s.id, x: s.x, y: s.y }));
  const rows: AirEffect["rows"] = [];
  for (const receiver of table.receivers) {
    const position = run.header.receivers.find((r) => r.id === receiver.receiverId);
    const nearest = position ? nearestSource(position, sources) : undefined;
    if (!nearest) return "The run has no source, so there is no distance for air absorption.";
    const attenuation = bandAirAttenuation(table.bands, nearest.distance, atmosphere);
    rows.push({ distance: nearest.distance, sourceLabel: nearest.source.label, attenuation, levels: receiver.levels.map((level, b) => level - attenuation[b]!) });
  }
  const h = molarConcentrationOfWaterVapour(atmosphere);
  const note = `air absorption per ISO 9613-1 at ${atmosphere.temperatureCelsius} °C, ${atmosphere.relativeHumidity} % RH, ${(atmosphere.pressure / 1000).toFixed(1)} kPa over the distance to the nearest source`;
  return { rows, note: h < 0.05 || h > 5 ? `${note} (water vapour ${h.toFixed(2)} % is outside the range the standard states its accuracy for)` : note };
}

const tableCell = "px-2 py-1 text-right tabular-nums";

export function BandLevelsPanel({ run, runId, studyId, receiverIds, highestResolvedFrequency, sceneTemperature = 20 }: BandLevelsPanelProps) {
  const [bandsPerOctave, setBandsPerOctave] = useState<BandsPerOctave>(1);
  const [weighting, setWeighting] = useState<"Z" | "A">("Z");
  const [airOn, setAirOn] = useState(false);
  const [air, setAir] = useState<AirInputs>({ temperature: String(sceneTemperature), humidity: "70", pressureKpa: "101.325" });
  const svg = useRef<SVGSVGElement>(null);

  const chosen = useMemo(() => run.receivers.filter((receiver) => receiverIds.includes(receiver.id)), [run, receiverIds]);
  const outcome = useMemo((): { table: BandLevelTable } | { problem: string } | null => {
    if (chosen.length === 0) return null;
    try {
      return { table: bandLevelTable(chosen, { bandsPerOctave, highestResolvedFrequency, weighting }) };
    } catch (error) {
      return { problem: error instanceof Error ? error.message : String(error) };
    }
  }, [chosen, bandsPerOctave, highestResolvedFrequency, weighting]);

  const airParse = useMemo(() => parseAir(air), [air]);
  const effect = useMemo(() => (airOn && airParse.ok && outcome && "table" in outcome ? airEffect(outcome.table, run, airParse.atmosphere) : null), [airOn, airParse, outcome, run]);

  const unit = weighting === "A" ? "dB(A) re 20 µPa" : "dB re 20 µPa";
  const table = outcome && "table" in outcome ? outcome.table : null;
  const careful = useCarefulBands(run, table?.bands, bandsPerOctave);
  const airRows = effect && typeof effect !== "string" ? effect.rows : null;
  const shownLevels = (r: number) => airRows?.[r]?.levels ?? table!.receivers[r]!.levels;
  const indexOf = (id: string) => run.receivers.findIndex((receiver) => receiver.id === id);

  return (
    <AnalysisPanel
      title="Band levels"
      testId="band-levels"
      description={
        table ? (
          <>
            Equivalent levels over the whole trace ({(table.averagingTime * 1000).toFixed(1)} ms), {unit}, from the FFT of each receiver&apos;s pressure (IEC 61260-1 band edges). Only bands below the
            highest resolved frequency ({highestResolvedFrequency.toFixed(0)} Hz) are shown.
          </>
        ) : undefined
      }
      actions={
        <>
          <Segmented label="Bands" value={bandsPerOctave} onChange={setBandsPerOctave} options={[{ value: 1, label: "Octave" }, { value: 3, label: "1/3 octave" }]} />
          <Segmented label="Frequency weighting" value={weighting} onChange={setWeighting} options={[{ value: "Z", label: "Unweighted", title: "Z: no frequency weighting" }, { value: "A", label: "A-weighted", title: "A-weighting of IEC 61672-1" }]} />
          {studyId ? (
            <AddChartButton
              studyId={studyId}
              runId={runId}
              choices={{ quantity: "band-levels", runIds: [runId], receiverIds: chosen.map((receiver) => receiver.id), bandsPerOctave, weighting }}
              unavailableReason={chosen.length === 0 ? "Choose at least one receiver first." : undefined}
            />
          ) : null}
        </>
      }
    >
      <fieldset className="flex flex-wrap items-end gap-3 rounded-md border border-rule px-3 py-2 text-[13px]">
        <legend className="px-1 text-xs font-medium text-ink-soft">Air absorption (ISO 9613-1)</legend>
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={airOn} onChange={(event) => setAirOn(event.target.checked)} />
          Subtract air absorption
        </label>
        {(
          [
            ["temperature", "Temperature", "°C"],
            ["humidity", "Relative humidity", "%"],
            ["pressureKpa", "Pressure", "kPa"],
          ] as const
        ).map(([key, label, suffix]) => (
          <label key={key} className="flex flex-col gap-0.5 text-xs text-ink-soft">
            {label} ({suffix})
            <input
              inputMode="decimal"
              disabled={!airOn}
              value={air[key]}
              onChange={(event) => setAir({ ...air, [key]: event.target.value })}
              className="h-7 w-24 rounded-md border border-rule-strong bg-panel px-2 font-mono text-[13px] text-ink disabled:text-muted"
            />
          </label>
        ))}
        {airOn && !airParse.ok ? (
          <span role="alert" className="text-xs text-signal-error">
            {airParse.message}
          </span>
        ) : null}
        {typeof effect === "string" ? (
          <span role="alert" className="text-xs text-signal-error">
            {effect}
          </span>
        ) : null}
      </fieldset>

      {outcome === null ? <Note>Choose at least one receiver above to see its band levels.</Note> : null}
      {outcome && "problem" in outcome ? (
        <p role="alert" className="text-sm text-signal-error">
          The band levels could not be computed: {outcome.problem}
        </p>
      ) : null}
      {table && table.bands.length === 0 ? <Note>No band in this range is resolved by the grid; see the reasons below.</Note> : null}
      {table && table.bands.length > 0 ? (
        <>
          <div className="overflow-x-auto">
            <table className="min-w-full border-collapse font-mono text-[12px]" data-testid="band-level-table">
              <BandTableHead bands={table.bands} showCentre careful={careful} />
              <tbody>
                {table.receivers.map((receiver, r) => (
                  <Fragment key={receiver.receiverId}>
                    <ReceiverBandRow label={receiver.label} colour={receiverColour(indexOf(receiver.receiverId))} overall={sumLevels(shownLevels(r))} values={shownLevels(r)} />
                    {airRows?.[r] ? (
                      <tr className="border-b border-rule text-muted">
                        <th scope="row" className="px-2 py-1 text-left font-sans font-normal text-[11px]">
                          air absorption over {airRows[r].distance.toFixed(1)} m from {airRows[r].sourceLabel}
                        </th>
                        <td className={tableCell} />
                        {Array.from(airRows[r].attenuation, (loss, b) => (
                          <td key={b} className={tableCell}>
                            {loss < 0.0005 ? "0.000" : `−${loss.toFixed(loss < 0.1 ? 3 : 2)}`}
                          </td>
                        ))}
                      </tr>
                    ) : null}
                  </Fragment>
                ))}
              </tbody>
            </table>
          </div>
          <BandBarChart
            svgRef={svg}
            bands={table.bands}
            groups={table.receivers.map((receiver, r) => ({ label: receiver.label, colour: receiverColour(indexOf(receiver.receiverId)), values: shownLevels(r) }))}
            unit={unit}
            quantity="Band level"
            ariaLabel={`Band levels of ${table.receivers.map((r) => r.label).join(", ")}`}
            careful={careful}
          />
          <UseWithCareLegend careful={careful} />
          <div className="flex flex-wrap items-center justify-between gap-2">
            <Note>
              {airRows ? `Levels after ${effect && typeof effect !== "string" ? effect.note : ""}. ${BAND_CENTRE_SIMPLIFICATION} ` : ""}Hover a band heading or a bar for its exact edges.
            </Note>
            <div className="flex gap-2">
              <ExportButton
                label="CSV"
                onExport={() =>
                  downloadCsv(
                    bandLevelsCsv(table, airRows && effect && typeof effect !== "string" ? { levels: airRows.map((row) => row.levels), note: effect.note } : {}),
                    exportFileName(runId, `band-levels-${bandFileTag(bandsPerOctave, weighting)}`, "csv"),
                  )
                }
              />
              <ExportButton label="PNG" onExport={async () => downloadBlob(await svgChartPng(svg.current!), exportFileName(runId, "band-levels", "png"))} />
            </div>
          </div>
        </>
      ) : null}
      {table && table.excluded.length > 0 ? (
        <details className="text-[12px] text-ink-soft">
          <summary className="cursor-pointer text-muted">
            {table.excluded.length} band{table.excluded.length === 1 ? "" : "s"} left out
          </summary>
          <ul className="mt-1 list-disc pl-5">
            {table.excluded.map((excluded) => (
              <li key={excluded.band.index}>
                {formatHz(excluded.band.nominal)}: {excluded.message}
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </AnalysisPanel>
  );
}
