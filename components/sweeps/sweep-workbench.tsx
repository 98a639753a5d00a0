"use client";
// The sweeps page: choose a scene of the study, a parameter and its range, the reference and the bands;
// see how many runs that makes and about how long they take; run them here in the browser or send them
// to the server's workers; read the insertion loss per band against the parameter; keep it in the notebook.
import { RESOLVED_POINTS_PER_WAVELENGTH, resolvedFrequencyLimit } from "@/lib/analysis/accuracy";
import Link from "next/link";
import { useEffect, useMemo, useState } from "react";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { rateOf, useStepRate } from "@/components/scene-editor/step-rate/use-step-rate";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { Button } from "@/components/ui/button";
import { EmptyState, ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows, type TeamRole } from "@/lib/access/roles";
import { ServerSweepStatus } from "@/components/queue/server-sweep-status";
import { refusalWords } from "@/components/queue/model/queue-words";
import { ApiError, fetchJson } from "@/lib/client/api";
import { useQueueSweep, useServerSweep, type SweepAnswer } from "@/lib/client/job-queries";
import { useRouter } from "next/navigation";
import { queryKeys, useBlocks, useStudy } from "@/lib/client/queries";
import { deriveGrid } from "@/lib/fdtd/grid";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import type { BlockItem, SceneListItem } from "@/lib/http/api-types";
import { removableElements } from "@/lib/scene-variants/reference-scene";
import { MAX_SWEEP_CASES, sweepValues } from "@/lib/scene-variants/sweep";
import { chartContentSchema, MAX_SAVED_SWEEP_RECEIVERS, type SweepDefinition, type SweepReference } from "@/lib/validation/blocks";
import { formatEstimate, formatRate } from "./model/format-duration";
import { currentValue, defaultRange, defaultReceiverIds, defaultReference, estimatedSeconds, parameterChoices, parameterKey, planSweep, receiverOptions } from "@/lib/sweeps/sweep-plan";
import { SweepResultView } from "./sweep-result-view";
import { useSweepRun } from "./use-sweep-run";

const fieldClasses = "h-9 rounded-md border bg-panel px-2.5 text-[15px] text-ink focus:outline-none focus:ring-2";
const okField = "border-rule-strong focus:border-tide-500 focus:ring-tide-500/20";
const badField = "border-signal-error focus:ring-signal-error/25";

/** Receivers listed one by one at most; a long receiver line is cut short with a note. */
const LISTED_RECEIVERS = 200;

/** A cell updates rate for the estimate before anything has been measured: a modest laptop, one thread (from memory of this solver's benchmarks). */
const TYPICAL_RATE = 5e7;

function FieldMessage({ id, error, hint }: { id: string; error?: string; hint?: string }) {
  if (error) {
    return (
      <p id={id} role="alert" className="text-sm text-signal-error">
        {error}
      </p>
    );
  }
  return hint ? (
    <p id={id} className="text-sm text-muted">
      {hint}
    </p>
  ) : null;
}

interface SetupProps {
  studyId: string;
  role: TeamRole;
  record: SceneListItem;
  scene: Scene;
  initial: SweepDefinition | null;
  /** A server sweep of this scene to follow (from `?sweep=<id>`, set when it was sent). */
  followed: SweepAnswer | null;
}

function initialState(scene: Scene, initial: SweepDefinition | null) {
  const choices = parameterChoices(scene);
  const fromBlock = initial ? choices.find((choice) => choice.key === parameterKey(initial.parameter)) : undefined;
  const choice = fromBlock ?? choices[0];
  const range = initial && fromBlock ? initial.range : choice ? defaultRange(scene, choice.parameter) : { from: 0, to: 1, step: 0.5 };
  const known = new Set(receiverOptions(scene).map((r) => r.id));
  const receivers = initial ? initial.receiverIds.filter((id) => known.has(id)) : [];
  return {
    parameterKey: choice?.key ?? "",
    from: String(range.from),
    to: String(range.to),
    step: String(range.step),
    reference: initial?.reference ?? defaultReference(scene),
    bandsPerOctave: initial?.bandsPerOctave ?? (1 as 1 | 3),
    aWeighted: initial ? initial.weighting === "A" : false,
    receiverIds: receivers.length > 0 ? receivers : defaultReceiverIds(scene),
  };
}

function SweepSetup({ studyId, role, record, scene, initial, followed }: SetupProps) {
  const choices = useMemo(() => parameterChoices(scene), [scene]);
  const elements = useMemo(() => removableElements(scene), [scene]);
  const receivers = useMemo(() => receiverOptions(scene), [scene]);
  const grid = useMemo(() => deriveGrid(scene), [scene]);
  const [form, setForm] = useState(() => initialState(scene, initial));
  const { state, start, cancel } = useSweepRun();
  const stepRate = useStepRate();
  const client = useQueryClient();
  const canRun = roleAllows(role, "run:create") && roleAllows(role, "study:edit");
  const running = state.status.phase === "running";
  // Where the runs step: here (the page must stay open) or on the team's workers (it may be closed).
  const [where, setWhere] = useState<"browser" | "server">("browser");
  const queueSweep = useQueueSweep(record.id);
  const [serverSweep, setServerSweep] = useState<SweepAnswer | null>(followed);
  const router = useRouter();

  const choice = choices.find((c) => c.key === form.parameterKey);
  const range = { from: Number(form.from), to: Number(form.to), step: Number(form.step) };
  const blank = [form.from, form.to, form.step].some((text) => text.trim() === "");
  const values = blank ? ({ ok: false, message: "Give from, to and step." } as const) : sweepValues(range);
  const reference: SweepReference = form.reference;
  const planned = useMemo(() => {
    const numbers = { from: Number(form.from), to: Number(form.to), step: Number(form.step) };
    return choice && values.ok ? planSweep(scene, choice.parameter, numbers, reference) : null;
  }, [scene, choice, values.ok, form.from, form.to, form.step, reference]);
  const plan = planned?.ok ? planned.plan : null;
  const rangeError = !values.ok ? values.message : planned && !planned.ok && planned.field === "range" ? planned.message : undefined;
  const referenceError = planned && !planned.ok && planned.field === "reference" ? planned.message : undefined;
  const receiverError = form.receiverIds.length === 0 ? "Choose at least one receiver." : form.receiverIds.length > MAX_SAVED_SWEEP_RECEIVERS ? `Choose at most ${MAX_SAVED_SWEEP_RECEIVERS} receivers.` : undefined;

  const measuredHere = state.measuredRate;
  const benchmark = rateOf(stepRate);
  const rate = measuredHere ?? benchmark ?? TYPICAL_RATE;
  const rateSource = measuredHere ? "measured by this sweep's last run" : benchmark ? "measured on this computer with one thread; runs with several threads go faster" : "a typical rate, until this computer has been measured";

  const save = useMutation({
    mutationFn: (content: unknown) => fetchJson<{ block: BlockItem }>(`/api/studies/${studyId}/blocks`, { method: "POST", json: { kind: "chart", content, afterBlockId: null } }),
    onSuccess: () => Promise.all([client.invalidateQueries({ queryKey: queryKeys.blocks(studyId) }), client.invalidateQueries({ queryKey: queryKeys.study(studyId) })]),
  });

  // A page left mid-sweep loses the run in progress: ask first.
  useEffect(() => {
    if (!running) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [running]);

  const set = <K extends keyof typeof form>(key: K, value: (typeof form)[K]) => setForm((previous) => ({ ...previous, [key]: value }));
  const chooseParameter = (key: string) => {
    const next = choices.find((c) => c.key === key);
    if (!next) return;
    const nextRange = defaultRange(scene, next.parameter);
    setForm((previous) => ({ ...previous, parameterKey: key, from: String(nextRange.from), to: String(nextRange.to), step: String(nextRange.step) }));
  };
  const toggleRemoved = (id: string) => {
    const removed = form.reference.kind === "without" ? form.reference.removedIds : [];
    const next = removed.includes(id) ? removed.filter((x) => x !== id) : [...removed, id];
    set("reference", { kind: "without", removedIds: next });
  };
  const toggleReceiver = (id: string) => {
    const next = form.receiverIds.includes(id) ? form.receiverIds.filter((x) => x !== id) : [...form.receiverIds, id];
    // Kept in the scene's order, so the charts follow it whatever the order of clicks.
    set("receiverIds", receivers.map((r) => r.id).filter((x) => next.includes(x)));
  };

  const run = () => {
    if (!plan || !choice || receiverError) return;
    save.reset();
    const definition: SweepDefinition = {
      sceneId: record.id,
      sceneVersion: record.version,
      sceneName: scene.name || record.name,
      parameter: choice.parameter,
      parameterLabel: choice.label,
      unit: choice.unit,
      range,
      reference,
      bandsPerOctave: form.bandsPerOctave,
      weighting: form.aWeighted ? "A" : "Z",
      receiverIds: form.receiverIds,
    };
    if (where === "server") {
      queueSweep.mutate(
        { definition },
        {
          onSuccess: (answer) => {
            setServerSweep(answer);
            // In the address, so that a reload (or the link, shared) still follows this sweep.
            router.replace(`/studies/${studyId}/sweeps?scene=${record.id}&sweep=${answer.sweep.id}`, { scroll: false });
          },
        },
      );
      return;
    }
    void start({ plan, definition, receivers: receivers.filter((r) => form.receiverIds.includes(r.id)), highestResolvedFrequency: resolvedFrequencyLimit(grid) });
  };

  const results = state.results;
  const job = state.job;
  const finishedCases = results?.outcomes.filter((o) => o.status === "done").length ?? 0;
  const canSave = canRun && job && results && finishedCases > 0 && (state.status.phase === "finished" || state.status.phase === "cancelled");
  const saveSweep = () => {
    if (!job || !results) return;
    const content = { runIds: [], quantity: "sweep" as const, sweep: { definition: job.definition, results } };
    const checked = chartContentSchema.safeParse(content);
    if (!checked.success) {
      save.reset();
      window.alert(`The result cannot be saved: ${checked.error.issues[0]?.message ?? "it is not valid"}`);
      return;
    }
    save.mutate(checked.data);
  };
  const current = choice ? currentValue(scene, choice.parameter) : undefined;
  const elementLabel = (id: string) => elements.find((e) => e.id === id)?.label ?? id;

  return (
    <div className="flex flex-col gap-6">
      <form
        className="grid gap-6 rounded-lg border border-rule bg-panel p-5 lg:grid-cols-2"
        onSubmit={(event) => {
          event.preventDefault();
          run();
        }}
        aria-label="Sweep definition"
      >
        <fieldset className="flex flex-col gap-4" disabled={running}>
          <div className="flex flex-col gap-1.5">
            <label htmlFor="sweep-parameter" className="text-sm font-medium text-ink-soft">
              Parameter
            </label>
            {choices.length === 0 ? (
              <p className="text-sm text-muted">This scene has no wall, receiver or source to vary.</p>
            ) : (
              <select id="sweep-parameter" className={`${fieldClasses} ${okField}`} value={form.parameterKey} onChange={(event) => chooseParameter(event.target.value)}>
                {(["Walls", "Receivers", "Sources"] as const).map((group) => {
                  const inGroup = choices.filter((c) => c.group === group);
                  return inGroup.length === 0 ? null : (
                    <optgroup key={group} label={group}>
                      {inGroup.map((c) => (
                        <option key={c.key} value={c.key}>
                          {c.label[0]!.toUpperCase() + c.label.slice(1)}
                        </option>
                      ))}
                    </optgroup>
                  );
                })}
              </select>
            )}
            {choice && current !== undefined ? (
              <p className="text-sm text-muted">
                Now {Number(current.toPrecision(4))}
                {choice.unit ? ` ${choice.unit}` : ""} in the saved scene.
              </p>
            ) : null}
          </div>

          <div className="flex flex-col gap-1.5">
            <span className="text-sm font-medium text-ink-soft" id="sweep-range-label">
              Range{choice?.unit ? ` (${choice.unit})` : ""}
            </span>
            <div className="grid grid-cols-3 gap-2" role="group" aria-labelledby="sweep-range-label">
              {(["from", "to", "step"] as const).map((key) => (
                <label key={key} className="flex flex-col gap-1 text-[13px] text-muted">
                  {key === "from" ? "From" : key === "to" ? "To" : "Step"}
                  <input
                    type="number"
                    inputMode="decimal"
                    step="any"
                    value={form[key]}
                    onChange={(event) => set(key, event.target.value)}
                    aria-invalid={rangeError ? true : undefined}
                    aria-describedby="sweep-range-message"
                    className={`${fieldClasses} ${rangeError ? badField : okField} tabular`}
                  />
                </label>
              ))}
            </div>
            <FieldMessage id="sweep-range-message" error={rangeError} hint={values.ok ? `${values.values.length} values: ${values.values.join(", ")}` : `At most ${MAX_SWEEP_CASES} values, both ends included.`} />
          </div>

          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 text-sm font-medium text-ink-soft">Reference for the insertion loss</legend>
            <label className="flex items-center gap-2 text-sm text-ink">
              <input type="radio" name="sweep-reference" checked={form.reference.kind === "without"} onChange={() => set("reference", defaultReference(scene).kind === "without" ? defaultReference(scene) : { kind: "without", removedIds: elements[0] ? [elements[0].id] : [] })} disabled={elements.length === 0} />
              The same scene without chosen elements
            </label>
            {form.reference.kind === "without" ? (
              <ul className="ml-6 flex max-h-40 flex-col gap-1 overflow-y-auto">
                {elements.map((element) => (
                  <li key={element.id}>
                    <label className="flex items-center gap-2 text-sm text-ink-soft">
                      <input type="checkbox" checked={form.reference.kind === "without" && form.reference.removedIds.includes(element.id)} onChange={() => toggleRemoved(element.id)} />
                      {element.label} <span className="text-muted">({element.kind})</span>
                    </label>
                  </li>
                ))}
              </ul>
            ) : null}
            <label className="flex items-center gap-2 text-sm text-ink">
              <input type="radio" name="sweep-reference" checked={form.reference.kind === "free-field"} onChange={() => set("reference", { kind: "free-field" })} />
              Free field (no geometry, absorbing layers on every side)
            </label>
            <FieldMessage id="sweep-reference-message" error={referenceError} hint={plan ? (plan.sharedReference ? "Every case is compared with one reference run." : `The swept element stays in the reference, so each case has its own reference run (${plan.referenceCount}).`) : undefined} />
          </fieldset>
        </fieldset>

        <fieldset className="flex flex-col gap-4" disabled={running}>
          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 text-sm font-medium text-ink-soft">Bands</legend>
            <div className="flex flex-wrap gap-4">
              <label className="flex items-center gap-2 text-sm text-ink">
                <input type="radio" name="sweep-bands" checked={form.bandsPerOctave === 1} onChange={() => set("bandsPerOctave", 1)} />
                Octave
              </label>
              <label className="flex items-center gap-2 text-sm text-ink">
                <input type="radio" name="sweep-bands" checked={form.bandsPerOctave === 3} onChange={() => set("bandsPerOctave", 3)} />
                One-third octave
              </label>
              <label className="flex items-center gap-2 text-sm text-ink">
                <input type="checkbox" checked={form.aWeighted} onChange={(event) => set("aWeighted", event.target.checked)} />
                A-weighted
              </label>
            </div>
            <p className="text-sm text-muted">Bands up to {Math.round(resolvedFrequencyLimit(grid))} Hz, the highest frequency this grid resolves ({RESOLVED_POINTS_PER_WAVELENGTH} cells per wavelength at the upper edge); the rest are listed as left out with the reason.</p>
          </fieldset>

          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 text-sm font-medium text-ink-soft">Receivers in the result</legend>
            {receivers.length === 0 ? (
              <p className="text-sm text-signal-error">The scene has no receiver: add one in the scene editor first.</p>
            ) : (
              <ul className="flex max-h-44 flex-col gap-1 overflow-y-auto rounded-md border border-rule px-3 py-2">
                {receivers.slice(0, LISTED_RECEIVERS).map((receiver) => (
                  <li key={receiver.id}>
                    <label className="flex items-center gap-2 text-sm text-ink-soft">
                      <input type="checkbox" checked={form.receiverIds.includes(receiver.id)} onChange={() => toggleReceiver(receiver.id)} />
                      {receiver.label}
                    </label>
                  </li>
                ))}
                {receivers.length > LISTED_RECEIVERS ? <li className="text-[13px] text-muted">and {receivers.length - LISTED_RECEIVERS} more on receiver lines, not listed</li> : null}
              </ul>
            )}
            <FieldMessage id="sweep-receivers-message" error={receivers.length > 0 ? receiverError : undefined} hint={`One chart per receiver; at most ${MAX_SAVED_SWEEP_RECEIVERS}.`} />
          </fieldset>

          <div className="mt-auto flex flex-col gap-3 rounded-md bg-paper px-4 py-3">
            {canRun ? (
              <fieldset className="flex flex-col gap-1.5">
                <legend className="mb-1 text-sm font-medium text-ink-soft">Where to run</legend>
                <label className="flex items-center gap-2 text-sm text-ink">
                  <input type="radio" name="sweep-where" checked={where === "browser"} onChange={() => setWhere("browser")} />
                  In this browser (keep the page open until it ends)
                </label>
                <label className="flex items-center gap-2 text-sm text-ink">
                  <input type="radio" name="sweep-where" checked={where === "server"} onChange={() => setWhere("server")} />
                  On the server (the team&apos;s workers share the runs; you may close the browser)
                </label>
              </fieldset>
            ) : null}
            {plan && where === "server" ? (
              <p className="text-sm text-ink-soft" data-testid="sweep-estimate">
                <span className="font-medium text-ink">{plan.caseCount} cases</span> and {plan.referenceCount === 1 ? "1 reference" : `${plan.referenceCount} references`}: {plan.runs.length} runs of {(plan.cellUpdatesPerRun / 1e6).toPrecision(3)} million cell updates each, from saved version{" "}
                {record.version}, queued for the team&apos;s workers. The time left shows once a worker starts; the chart is written into the notebook when the last run ends.
              </p>
            ) : plan ? (
              <p className="text-sm text-ink-soft" data-testid="sweep-estimate">
                <span className="font-medium text-ink">{plan.caseCount} cases</span> and {plan.referenceCount === 1 ? "1 reference" : `${plan.referenceCount} references`}: {plan.runs.length} runs of {(plan.cellUpdatesPerRun / 1e6).toPrecision(3)} million cell updates each.
                Estimated time <span className="font-medium text-ink">{formatEstimate(estimatedSeconds(plan, rate))}</span> at {formatRate(rate)} ({rateSource}). An estimate only.
              </p>
            ) : (
              <p className="text-sm text-muted">Fix the fields marked above to see how many runs the sweep needs.</p>
            )}
            {canRun ? (
              <div className="flex gap-2">
                <Button type="submit" disabled={!plan || Boolean(receiverError) || running || queueSweep.isPending}>
                  {where === "server" ? (queueSweep.isPending ? "Queueing…" : "Send the sweep to the server") : "Run the sweep"}
                </Button>
              </div>
            ) : (
              <p className="text-sm text-muted">Only editors and owners run sweeps. Saved sweeps appear in the study&apos;s notebook.</p>
            )}
          </div>
        </fieldset>
      </form>

      {where === "server" && queueSweep.isError ? (
        <ErrorState title="The sweep was not queued" message={queueSweep.error instanceof ApiError ? refusalWords(queueSweep.error) : queueSweep.error.message} />
      ) : null}
      {serverSweep ? <ServerSweepStatus key={serverSweep.sweep.id} studyId={studyId} queued={serverSweep} canCancel={canRun} /> : null}
      {state.status.phase === "running" ? (
        <SweepProgress status={state.status} runCount={state.job?.plan.runs.length ?? 0} cellUpdatesPerRun={state.job?.plan.cellUpdatesPerRun ?? 0} caseCount={state.job?.plan.caseCount ?? 0} unit={state.job?.definition.unit ?? ""} label={state.job?.definition.parameterLabel ?? ""} onCancel={cancel} />
      ) : null}
      {state.status.phase === "failed" ? <ErrorState title="The sweep failed" message={state.status.message} /> : null}
      {state.status.phase === "cancelled" ? (
        <p role="status" className="rounded-md border border-signal-warn/30 bg-[#fdf6e7] px-3 py-2 text-sm text-ink-soft">
          Cancelled. The cases that finished are kept below; the others are marked as not run.
        </p>
      ) : null}
      {state.status.phase === "finished" ? (
        <p role="status" className="text-sm text-muted">
          Finished in {formatEstimate(state.status.seconds).replace("about ", "")}.
        </p>
      ) : null}

      {job && results ? (
        <section aria-labelledby="sweep-result-heading" className="flex flex-col gap-3">
          <div className="flex flex-wrap items-center justify-between gap-3">
            <h2 id="sweep-result-heading" className="text-lg font-semibold text-ink">
              Result
            </h2>
            {canRun ? (
              <div className="flex items-center gap-3">
                {save.isSuccess ? (
                  <p role="status" className="text-sm text-signal-ok">
                    Saved to the notebook.{" "}
                    <Link href={`/studies/${studyId}`} className="font-medium text-tide-600 hover:underline">
                      Open the study
                    </Link>
                  </p>
                ) : null}
                <Button onClick={saveSweep} disabled={!canSave || save.isPending || save.isSuccess}>
                  {save.isPending ? "Saving…" : "Save to the notebook"}
                </Button>
              </div>
            ) : null}
          </div>
          {save.isError ? <ErrorState title="The sweep was not saved" message={save.error.message} onRetry={saveSweep} /> : null}
          <SweepResultView definition={job.definition} results={results} elementLabel={elementLabel} />
        </section>
      ) : null}
    </div>
  );
}

function SweepProgress({
  status,
  runCount,
  caseCount,
  cellUpdatesPerRun,
  label,
  unit,
  onCancel,
}: {
  status: Extract<ReturnType<typeof useSweepRun>["state"]["status"], { phase: "running" }>;
  runCount: number;
  caseCount: number;
  cellUpdatesPerRun: number;
  label: string;
  unit: string;
  onCancel: () => void;
}) {
  const { run, fraction, cellUpdatesPerSecond } = status;
  const what = run.kind === "reference" ? `Reference run (${run.scene.name})` : `Case ${(run.caseIndex ?? 0) + 1} of ${caseCount}: ${label} = ${run.value}${unit ? ` ${unit}` : ""}`;
  const remaining = cellUpdatesPerSecond ? ((1 - fraction) * runCount * cellUpdatesPerRun) / cellUpdatesPerSecond : null;
  return (
    <section aria-label="Sweep progress" className="flex flex-col gap-3 rounded-lg border border-tide-300 bg-tide-50 p-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-sm text-ink" data-testid="sweep-current">
          Run {status.runIndex + 1} of {runCount}. {what}
        </p>
        <Button variant="secondary" size="sm" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      <div role="progressbar" aria-label="Sweep progress" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(fraction * 100)} className="h-2 overflow-hidden rounded-full bg-white">
        <div className="h-full rounded-full bg-tide-500 transition-[width]" style={{ width: `${Math.round(fraction * 1000) / 10}%` }} />
      </div>
      <p className="text-[13px] text-muted">
        {Math.round(fraction * 100)}% of the sweep{remaining !== null ? `; ${formatEstimate(remaining)} left (estimate)` : ""}. Cancelling keeps the cases that have finished.
      </p>
    </section>
  );
}

/** Loads the study (and, to run a saved sweep again, its notebook), then the setup for the chosen scene. */
export function SweepWorkbench({ studyId, sceneId, fromBlockId, followSweepId }: { studyId: string; sceneId?: string; fromBlockId?: string; followSweepId?: string }) {
  const study = useStudy(studyId);
  const blocks = useBlocks(studyId);
  const followed = useServerSweep(studyId, followSweepId);
  const fromBlock = useMemo(() => {
    if (!fromBlockId || !blocks.data) return null;
    const block = blocks.data.blocks.find((b) => b.id === fromBlockId);
    const parsed = block ? chartContentSchema.safeParse(block.content) : null;
    return parsed?.success && parsed.data.sweep ? parsed.data.sweep.definition : null;
  }, [fromBlockId, blocks.data]);
  const [chosenSceneId, setChosenSceneId] = useState<string | null>(null);

  if (study.isPending || (fromBlockId && blocks.isPending) || (followSweepId && followed.isPending)) return <LoadingRows label="Loading the study" rows={2} />;
  if (study.isError) return <ErrorState title="The study could not be loaded" message={study.error.message} onRetry={() => study.refetch()} />;
  const { study: record, role, scenes } = study.data;
  const followedSweep = followed.data && followed.data.sweep.studyId === studyId ? followed.data : null;
  const selectedId = chosenSceneId ?? fromBlock?.sceneId ?? followedSweep?.sweep.sceneId ?? sceneId ?? scenes.find((s) => !s.isReference)?.id ?? scenes[0]?.id;
  const selected = scenes.find((s) => s.id === selectedId);
  const parsed = selected ? parseScene(selected.data) : null;

  return (
    <div className="flex flex-col gap-6">
      <div>
        <Breadcrumb
          links={[
            { href: "/dashboard", label: "Studies" },
            { href: `/studies/${studyId}`, label: record.title },
          ]}
          current="Parameter sweep"
        />
        <h1 className="mt-2 text-[28px] leading-tight font-semibold text-ink">Parameter sweep</h1>
        <p className="mt-2 max-w-3xl text-[15px] leading-relaxed text-ink-soft">
          Step one quantity of a scene over a range, run every case here in your browser or on the server&apos;s workers, and compare each with a reference to read the insertion loss per band.
        </p>
      </div>
      {fromBlockId && !fromBlock ? <ErrorState title="That sweep was not found" message="The notebook has no sweep block with this id; start from a scene below." /> : null}
      {scenes.length === 0 ? (
        <EmptyState title="No scenes yet">Add a scene to the study first; a sweep varies one of its quantities.</EmptyState>
      ) : (
        <>
          <div className="flex max-w-xl flex-col gap-1.5">
            <label htmlFor="sweep-scene" className="text-sm font-medium text-ink-soft">
              Scene (its latest saved version)
            </label>
            <select id="sweep-scene" className={`${fieldClasses} ${okField}`} value={selected?.id ?? ""} onChange={(event) => setChosenSceneId(event.target.value)}>
              {scenes.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name} (version {s.version}){s.isReference ? ", reference" : ""}
                </option>
              ))}
            </select>
            {fromBlock && selected?.id === fromBlock.sceneId && selected.version !== fromBlock.sceneVersion ? (
              <p className="text-sm text-signal-warn">
                The saved sweep used version {fromBlock.sceneVersion}; the scene is now at version {selected.version}, which a new run uses.
              </p>
            ) : null}
          </div>
          {!selected || !parsed ? null : parsed.ok ? (
            <SweepSetup key={selected.id} studyId={studyId} role={role} record={selected} scene={parsed.scene} initial={fromBlock && fromBlock.sceneId === selected.id ? fromBlock : null}
              followed={followedSweep && followedSweep.sweep.sceneId === selected.id ? followedSweep : null}
            />
          ) : (
            <ErrorState title="This scene cannot be swept" message={`Its saved version is not valid: ${parsed.problems[0]?.path || "(scene)"}: ${parsed.problems[0]?.message ?? "unknown problem"}`} />
          )}
        </>
      )}
    </div>
  );
}
