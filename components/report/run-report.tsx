"use client";
// A saved run as a printable report: the study, the scene as run (figure, treatments, settings), the
// grid and its warnings, levels per receiver and octave band, insertion loss against a chosen reference
// run, who ran it and whether it has been reviewed, and the cautions. The browser's own print command
// makes the PDF; print styles put it on A4 and leave the app's header and controls out.
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useMemo } from "react";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { Button } from "@/components/ui/button";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { ApiError } from "@/lib/client/api";
import { useStudy } from "@/lib/client/queries";
import { useRun, useSavedRunPayload, useStudyRuns } from "@/lib/client/run-queries";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import type { RunRecord, StudyRecord } from "@/lib/http/api-types";
import type { DecodedRun } from "@/lib/run-record/payload";
import { bandHeading } from "@/components/sweeps/model/sweep-table";
import { ReportReviewBlock, reportReviewSentence } from "@/components/review/report-review-block";
import { QualityEvidence } from "@/components/verification/quality-evidence";
import { ReportAccuracySection } from "@/components/accuracy/report-accuracy-section";
import { resolvedFrequencyLimit } from "@/lib/analysis/accuracy";
import { referenceCandidates, runBandLevels, runInsertionLoss, settingsRows, treatmentRows } from "./model/report-model";
import { SceneFigure, SceneFigureKey } from "./scene-figure";

/** Receivers listed in the level tables at most; a long receiver line is cut short with a note. */
const LISTED_RECEIVERS = 40;

// @page and the app shell are outside Tailwind's reach from here: one small print sheet, scoped to
// pages that hold a report.
const PRINT_SHEET = `
@page { size: A4; margin: 16mm 14mm 18mm; }
@media print {
  html, body { background: #fff !important; }
  body:has([data-report-page]) header:not([data-report-page] *),
  body:has([data-report-page]) footer:not([data-report-page] *) { display: none !important; }
  body:has([data-report-page]) div:has(> [data-report-page]) { max-width: none !important; padding: 0 !important; margin: 0 !important; }
  [data-report-page] { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}`;

const exclusionWords = {
  "above-resolved-frequency": "above the highest frequency the grid resolves",
  "above-nyquist": "above the Nyquist frequency of the time step",
  "narrower-than-resolution": "narrower than the frequency resolution of the run's length",
} as const;

const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "long", timeStyle: "short" });
const db = (value: number | null | undefined) => (value === null || value === undefined || !Number.isFinite(value) ? "–" : value.toFixed(1));
const figure = (value: number, digits = 3) => String(Number(value.toPrecision(digits)));

function Section({ title, children, id }: { title: string; children: React.ReactNode; id: string }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3 border-t border-rule pt-5 print:pt-3">
      <h2 id={id} className="text-base font-semibold text-ink break-after-avoid print:text-[13pt]">
        {title}
      </h2>
      {children}
    </section>
  );
}

function Rows({ rows }: { rows: [string, string][] }) {
  return (
    <dl className="grid grid-cols-[minmax(9rem,auto)_1fr] gap-x-4 gap-y-1 text-sm break-inside-avoid print:text-[9.5pt]">
      {rows.map(([label, value]) => (
        <div key={label} className="contents">
          <dt className="text-muted">{label}</dt>
          <dd className="text-ink">{value}</dd>
        </div>
      ))}
    </dl>
  );
}

const tableClasses = "w-full border-collapse text-[13px] print:text-[8.5pt] [&_tr]:break-inside-avoid";
const headCell = "border-b border-rule-strong px-2 py-1 text-left font-medium text-muted";
const numberHead = "border-b border-rule-strong px-2 py-1 text-right font-medium text-muted whitespace-nowrap";
const cell = "border-b border-rule px-2 py-1 text-ink";
const numberCell = "border-b border-rule px-2 py-1 text-right font-mono tabular text-ink";

/** One header row; a column marked numeric is right-aligned like the figures under it. */
function HeadRow({ columns }: { columns: { label: React.ReactNode; key: string | number; numeric?: boolean }[] }) {
  return (
    <thead>
      <tr>
        {columns.map((column) => (
          <th key={column.key} scope="col" className={column.numeric ? numberHead : headCell}>
            {column.label}
          </th>
        ))}
      </tr>
    </thead>
  );
}

interface ReceiverBandRow {
  receiverId: string;
  label: string;
  /** Figures shown before the bands (from the run summary), in the order of `leading`. */
  leading?: (number | null | undefined)[];
  bands: ArrayLike<number>;
  overall: number;
}

/**
 * Receivers down, octave bands across, with optional figures before the bands and a bold total after
 * them; long receiver lines are cut at LISTED_RECEIVERS with a note. Band levels and insertion loss
 * share it, so both tables read alike on paper.
 */
function ReceiverBandTable({ bands, rows, leading = [], overallLabel }: { bands: { index: number; nominal: number }[]; rows: ReceiverBandRow[]; leading?: string[]; overallLabel: string }) {
  return (
    <>
      <div className="overflow-x-auto">
        <table className={tableClasses}>
          <HeadRow
            columns={[
              { key: "receiver", label: "Receiver" },
              ...leading.map((label) => ({ key: label, label, numeric: true })),
              ...bands.map((band) => ({ key: band.index, label: bandHeading(band.nominal), numeric: true })),
              { key: "overall", label: overallLabel, numeric: true },
            ]}
          />
          <tbody>
            {rows.slice(0, LISTED_RECEIVERS).map((row) => (
              <tr key={row.receiverId}>
                <th scope="row" className={`${cell} text-left font-normal`}>
                  {row.label || row.receiverId}
                </th>
                {(row.leading ?? []).map((value, k) => (
                  <td key={`leading-${k}`} className={numberCell}>
                    {db(value)}
                  </td>
                ))}
                {Array.from(row.bands, (value, b) => (
                  <td key={b} className={numberCell}>
                    {db(value)}
                  </td>
                ))}
                <td className={`${numberCell} font-semibold`}>{db(row.overall)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {rows.length > LISTED_RECEIVERS ? <p className="text-[13px] text-muted">The first {LISTED_RECEIVERS} of {rows.length} receivers are listed.</p> : null}
    </>
  );
}

function ReferencePicker({ run, studyId, referenceId }: { run: RunRecord; studyId: string; referenceId: string | null }) {
  const runs = useStudyRuns(studyId);
  const router = useRouter();
  const pathname = usePathname();
  const searchParams = useSearchParams();
  const candidates = useMemo(() => {
    if (!runs.data) return [];
    const self = runs.data.runs.find((r) => r.id === run.id);
    return self ? referenceCandidates(runs.data.runs, self) : [];
  }, [runs.data, run.id]);
  const choose = (id: string) => {
    const params = new URLSearchParams(searchParams.toString());
    if (id) params.set("reference", id);
    else params.delete("reference");
    const query = params.toString();
    router.replace(query ? `${pathname}?${query}` : pathname, { scroll: false });
  };
  if (runs.isPending) return <p className="text-sm text-muted print:hidden">Looking for reference runs on the same grid…</p>;
  if (runs.isError) return <p className="text-sm text-signal-error print:hidden">The study&apos;s runs could not be listed: {runs.error.message}</p>;
  return (
    <div className="flex flex-col gap-1.5 print:hidden">
      <label htmlFor="report-reference" className="text-sm font-medium text-ink-soft">
        Reference run for the insertion loss
      </label>
      <select id="report-reference" value={referenceId ?? ""} onChange={(event) => choose(event.target.value)} className="h-9 max-w-xl rounded-md border border-rule-strong bg-panel px-2.5 text-[15px] text-ink focus:border-tide-500 focus:ring-2 focus:ring-tide-500/20 focus:outline-none">
        <option value="">None: leave the insertion loss out</option>
        {candidates.map((candidate) => (
          <option key={candidate.id} value={candidate.id}>
            {candidate.sceneName ?? "Deleted scene"} v{candidate.sceneVersion}, {when(candidate.createdAt)}
          </option>
        ))}
      </select>
      <p className="text-[13px] text-muted">{candidates.length === 0 ? "No other finished run of this study lies on the same grid." : "Saved runs of this study on the same grid. Shown on screen only; the printed page names the one chosen."}</p>
    </div>
  );
}

function InsertionLossPart({ run, decoded, referenceId, highestResolvedFrequency }: { run: RunRecord; decoded: DecodedRun; referenceId: string; highestResolvedFrequency: number }) {
  const reference = useRun(referenceId);
  const payload = useSavedRunPayload(referenceId);
  const table = useMemo(() => (payload.data ? runInsertionLoss(decoded, payload.data, highestResolvedFrequency) : null), [payload.data, decoded, highestResolvedFrequency]);
  if (reference.isPending || payload.isPending) return <LoadingRows rows={1} label="Loading the reference run" />;
  if (reference.isError || payload.isError) {
    const error = reference.error ?? payload.error;
    return <ErrorState title="The reference run could not be loaded" message={error?.message ?? "Unknown error."} />;
  }
  if (reference.data.run.studyId !== run.studyId) return <ErrorState title="Not a run of this study" message="Choose a reference from this study's runs." />;
  if (!table) return null;
  if (!table.ok) return <ErrorState title="No insertion loss" message={table.message} />;
  const { bands, receivers } = table.value;
  const ref = reference.data.run;
  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-ink-soft">
        IL = level of the reference minus level of this run, per octave band (unweighted). Reference run: <span className="font-medium text-ink">{ref.sceneName ?? "deleted scene"}</span> version {ref.sceneVersion}, run {when(ref.createdAt)}
        {ref.createdByName ? ` by ${ref.createdByName}` : ""}.
      </p>
      <ReceiverBandTable bands={bands} rows={receivers.map((receiver) => ({ receiverId: receiver.receiverId, label: receiver.label, bands: receiver.insertionLoss, overall: receiver.overall }))} overallLabel="Overall" />
    </div>
  );
}

function ReportBody({ study, run, decoded, scene, referenceId }: { study: StudyRecord; run: RunRecord; decoded: DecodedRun; scene: Scene; referenceId: string | null }) {
  const grid = useMemo(() => deriveGrid(scene), [scene]);
  const bandLevels = useMemo(() => runBandLevels(decoded, resolvedFrequencyLimit(grid)), [decoded, grid]);
  const treatments = treatmentRows(scene);
  const summary = run.summary;
  const header = decoded.header;
  const warnings = summary?.warnings ?? header.warnings;
  const receiverSummaries = new Map((summary?.receivers ?? []).map((r) => [r.id, r]));

  const gridRows: [string, string][] = [
    ["Cell size", `${figure(header.grid.cellSize * 1000)} mm`],
    ["Time step", `${figure(header.grid.timeStep * 1e6)} µs`],
    ["Grid incl. PML", `${header.grid.nx} × ${header.grid.ny} = ${(header.grid.nx * header.grid.ny).toLocaleString("en-GB")} cells`],
    ["Steps", `${header.run.stepsRun.toLocaleString("en-GB")} of ${header.grid.plannedSteps.toLocaleString("en-GB")} planned (${figure(header.run.simulatedSeconds * 1000)} ms simulated; stopped by ${header.run.stoppedBy})`],
    ["Engine", `${header.engine.kernel}, ${header.engine.threads} thread${header.engine.threads === 1 ? "" : "s"}; ${figure(header.run.setupSeconds + header.run.runSeconds)} s`],
    ["Solver version", header.solverVersion],
    ["Input hash", `${header.inputHash.slice(0, 16)}…`],
  ];

  return (
    <>
      <Section title="The scene as run" id="report-scene">
        <div className="rounded-md border border-rule bg-white p-2 break-inside-avoid">
          <SceneFigure scene={scene} cellSize={header.grid.cellSize} />
        </div>
        <SceneFigureKey />
      </Section>

      <Section title="Materials and treatments" id="report-materials">
        {treatments.length === 0 ? (
          <p className="text-sm text-muted">No solids, walls or treated surfaces; every outer side absorbs.</p>
        ) : (
          <table className={tableClasses}>
            <HeadRow
              columns={[
                { key: "element", label: "Element" },
                { key: "kind", label: "Kind" },
                { key: "treatment", label: "Treatment" },
                { key: "absorption", label: "α (normal incidence)", numeric: true },
              ]}
            />
            <tbody>
              {treatments.map((row, k) => (
                <tr key={`${row.kind}-${row.element}-${k}`}>
                  <td className={cell}>{row.element}</td>
                  <td className={cell}>{row.kind}</td>
                  <td className={cell}>{row.treatment}</td>
                  <td className={numberCell}>{row.absorption.toFixed(2)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {treatments.some((row) => row.source) ? (
          <p className="text-[12px] leading-relaxed text-muted">
            Table materials use one absorption coefficient for every frequency: a typical handbook value near 500 Hz to 1 kHz, recalled from memory, with the random-incidence value used as a normal-incidence one. Treat them as approximate.
          </p>
        ) : null}
      </Section>

      <Section title="Settings" id="report-settings">
        <Rows rows={settingsRows(scene, grid)} />
      </Section>

      <Section title="Grid and run" id="report-grid">
        <Rows rows={gridRows} />
        {warnings.length > 0 ? (
          <ul aria-label="Warnings" className="flex flex-col gap-1.5">
            {warnings.map((warning, k) => (
              <li key={`${warning.code}-${k}`} className="rounded-md border border-signal-warn/30 bg-[#fdf6e7] px-3 py-1.5 text-[13px] text-ink-soft print:text-[9pt]">
                <span className="font-medium text-signal-warn">Check: </span>
                {warning.message}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-muted">The solver raised no warnings for this grid.</p>
        )}
      </Section>

      <ReportAccuracySection decoded={decoded} />
      <Section title="Levels at the receivers" id="report-levels">
        {!bandLevels.ok ? (
          <ErrorState title="No band levels" message={bandLevels.message} />
        ) : (
          <>
            <p className="text-sm text-ink-soft">
              Energy-equivalent levels over the {figure(bandLevels.value.averagingTime * 1000)} ms simulated, dB re 20 µPa, unweighted, in the octave bands the grid resolves (up to {figure(resolvedFrequencyLimit(grid))} Hz). Peak levels from the run summary.
            </p>
            <ReceiverBandTable
              bands={bandLevels.value.bands}
              leading={["Peak", "Leq"]}
              rows={bandLevels.value.receivers.map((receiver) => {
                const summaryRow = receiverSummaries.get(receiver.receiverId);
                return { receiverId: receiver.receiverId, label: receiver.label, leading: [summaryRow?.peakLevelDb, summaryRow?.leqDb], bands: receiver.levels, overall: receiver.overall };
              })}
              overallLabel="Bands total"
            />
            {bandLevels.value.excluded.length > 0 ? (
              <p className="text-[12px] text-muted">
                Left out:{" "}
                {Object.entries(Object.groupBy(bandLevels.value.excluded, (e) => e.reason))
                  .map(([reason, list]) => `${(list ?? []).map((e) => bandHeading(e.band.nominal)).join(", ")} (${exclusionWords[reason as keyof typeof exclusionWords]})`)
                  .join("; ")}
                .
              </p>
            ) : null}
          </>
        )}
      </Section>

      <Section title="Insertion loss" id="report-insertion-loss">
        <ReferencePicker run={run} studyId={study.id} referenceId={referenceId} />
        {referenceId ? (
          <InsertionLossPart run={run} decoded={decoded} referenceId={referenceId} highestResolvedFrequency={resolvedFrequencyLimit(grid)} />
        ) : (
          <p className="text-sm text-muted">No reference run chosen, so no insertion loss is reported.</p>
        )}
      </Section>

      <Section title="Provenance and review" id="report-review">
        <Rows
          rows={[
            ["Run by", `${run.createdByName ?? "a former member"}, ${when(run.createdAt)}`],
            ["Scene", `${run.sceneName ?? scene.name ?? "deleted scene"}, version ${run.sceneVersion}`],
            ["Run id", run.id],
          ]}
        />
        <ReportReviewBlock run={run} />
      </Section>
      <QualityEvidence run={run} variant="report" />
    </>
  );
}

export function RunReport({ studyId, runId }: { studyId: string; runId: string }) {
  const study = useStudy(studyId);
  const run = useRun(runId);
  const payload = useSavedRunPayload(run.data && run.data.run.status === "completed" ? runId : null);
  const searchParams = useSearchParams();
  const requested = searchParams.get("reference");
  const referenceId = requested && /^[0-9a-f-]{36}$/i.test(requested) && requested !== runId ? requested : null;
  const scene = useMemo(() => (payload.data ? parseScene(payload.data.header.scene) : null), [payload.data]);

  let body: React.ReactNode;
  if (study.isPending || run.isPending) body = <LoadingRows label="Loading the run" rows={3} />;
  else if (study.isError || run.isError) {
    const error = study.error ?? run.error;
    const notFound = error instanceof ApiError && error.status === 404;
    body = <ErrorState title={notFound ? "No such run" : "The report could not be loaded"} message={notFound ? "It may have been deleted, or it belongs to a team you are not on." : (error?.message ?? "Unknown error.")} onRetry={notFound ? undefined : () => void Promise.all([study.refetch(), run.refetch()])} />;
  } else if (run.data.run.studyId !== studyId) {
    body = <ErrorState title="This run belongs to another study" message="Open the report from the study the run was saved in." />;
  } else if (run.data.run.status !== "completed") {
    body = <ErrorState title="No results to report" message={`The run is ${run.data.run.status}${run.data.run.statusMessage ? `: ${run.data.run.statusMessage}` : "."}`} />;
  } else if (payload.isPending) body = <LoadingRows label="Loading the run's results" rows={3} />;
  else if (payload.isError) body = <ErrorState title="The run's results could not be loaded" message={payload.error.message} onRetry={() => void payload.refetch()} />;
  else if (!scene?.ok) body = <ErrorState title="The frozen scene cannot be read" message={scene && !scene.ok ? `${scene.problems[0]?.path || "(scene)"}: ${scene.problems[0]?.message ?? "unknown problem"}` : "Unknown problem."} />;
  else body = <ReportBody study={study.data.study} run={run.data.run} decoded={payload.data} scene={scene.scene} referenceId={referenceId} />;

  const studyRecord = study.data?.study;
  return (
    <article data-report-page className="mx-auto flex w-full max-w-[210mm] flex-col gap-5 rounded-lg border border-rule bg-panel px-10 py-9 shadow-sm print:max-w-none print:gap-4 print:rounded-none print:border-0 print:p-0 print:shadow-none">
      <style>{PRINT_SHEET}</style>
      <div className="flex flex-wrap items-center justify-between gap-3 print:hidden">
        <Breadcrumb links={[{ href: `/studies/${studyId}`, label: studyRecord?.title ?? "Study" }]} current="Run report" />
        <Button onClick={() => window.print()} disabled={!payload.data}>
          Print or save as PDF
        </Button>
      </div>
      <div className="flex flex-col gap-1.5">
        <p className="text-[12px] font-medium tracking-wide text-tide-700 uppercase">Rarefact · simulation report</p>
        <h1 className="text-[26px] leading-tight font-semibold text-ink print:text-[18pt]">{studyRecord?.title ?? "…"}</h1>
        {studyRecord?.siteReference ? <p className="text-sm text-ink-soft">Site reference: {studyRecord.siteReference}</p> : null}
        {studyRecord?.description ? <p className="max-w-3xl text-[15px] leading-relaxed text-ink-soft print:text-[10pt]">{studyRecord.description}</p> : null}
        {run.data ? (
          <p className="text-sm text-muted">
            {run.data.run.sceneName ?? "Deleted scene"} (version {run.data.run.sceneVersion}), run {when(run.data.run.createdAt)}
            {run.data.run.createdByName ? ` by ${run.data.run.createdByName}` : ""}. {reportReviewSentence(run.data.run)}
          </p>
        ) : null}
      </div>
      {body}
      <section aria-labelledby="report-cautions" className="flex flex-col gap-2 rounded-md border border-ember-500/30 bg-ember-50 px-4 py-3 print:break-inside-avoid">
        <h2 id="report-cautions" className="text-sm font-semibold text-ember-700">
          Cautions
        </h2>
        <ul className="list-disc pl-5 text-[13px] leading-relaxed text-ink-soft print:text-[9pt]">
          <li>This is a 2D section: it models a coherent line source and barriers, buildings and ground that are infinitely long, perpendicular to the page. Real sources and barriers are finite, so 3D levels and insertion losses differ.</li>
          <li>It is not a statutory noise assessment. Local regulations and licensed practice govern any assessment, and the methods they require take precedence over these figures.</li>
          <li>Levels depend on the source amplitude chosen in the scene; compare runs with the same sources, and read insertion losses rather than absolute levels where the source strength is uncertain.</li>
        </ul>
      </section>
    </article>
  );
}
