"use client";
// A source's signal: its kind and parameters, how high its spectrum reaches compared with the band
// the grid resolves (the same -30 dB band edge the solver's warning uses), and a plot of both.
import type { GridPlan } from "@/lib/fdtd/grid";
import type { Signal } from "@/lib/fdtd/scene";
import { prepareSignal } from "@/lib/fdtd/signals";

import { formatNumber, NumberField, SelectField, type Choice, type Commit } from "./inspector-fields";
import { SignalPlot } from "./signal-plot";

type SignalKind = Signal["kind"];

const SIGNAL_CHOICES: Choice<SignalKind>[] = [
  { value: "ricker", label: "Ricker pulse" },
  { value: "gaussianPulse", label: "Gaussian pulse" },
  { value: "toneBurst", label: "Tone burst" },
  { value: "sine", label: "Continuous sine" },
];

/** The frequency that characterises a signal (peak, carrier), Hz. */
function characteristicFrequency(signal: Signal): number {
  switch (signal.kind) {
    case "ricker":
      return signal.peakFrequency;
    case "gaussianPulse":
      return 1 / (2 * Math.PI * signal.width);
    case "toneBurst":
    case "sine":
      return signal.frequency;
    case "sampled":
      return signal.sampleRate / 10;
  }
}

/** A signal of `kind` around the same frequency as `current`. */
export function convertSignal(current: Signal, kind: SignalKind): Signal {
  const f = Number(characteristicFrequency(current).toPrecision(3));
  switch (kind) {
    case "ricker":
      return { kind: "ricker", peakFrequency: f };
    case "gaussianPulse":
      // A Gaussian of standard deviation 1 / (2 pi f) has its spectrum 1/e^(1/2) down at f.
      return { kind: "gaussianPulse", width: Number((1 / (2 * Math.PI * f)).toPrecision(3)) };
    case "toneBurst":
      return { kind: "toneBurst", frequency: f, cycles: 4 };
    case "sine":
      return { kind: "sine", frequency: f, rampCycles: 3 };
    case "sampled":
      return current;
  }
}

const required = (commit: (value: number) => string | null) => (value: number | undefined) => (value === undefined ? "required" : commit(value));

export function SignalEditor({ signal, grid, onCommit }: { signal: Signal; grid: GridPlan; onCommit: Commit<Signal> }) {
  const choices = signal.kind === "sampled" ? [...SIGNAL_CHOICES, { value: "sampled" as const, label: "Sampled (edit in the code view)" }] : SIGNAL_CHOICES;
  const upper = prepareSignal(signal, grid.timeStep).upperFrequency;
  const resolved = grid.maxResolvedFrequency;
  const aboveBand = upper > resolved;
  return (
    <div className="flex flex-col gap-3">
      <SelectField label="Signal" value={signal.kind} choices={choices} testId="signal-kind" onChange={(kind) => onCommit(convertSignal(signal, kind))} />
      {signal.kind === "ricker" ? (
        <div className="grid grid-cols-2 gap-2">
          <NumberField label="Peak frequency" unit="Hz" value={signal.peakFrequency} min={0} exclusiveMin testId="signal-peak-frequency" onCommit={required((peakFrequency) => onCommit({ ...signal, peakFrequency }))} />
          <NumberField
            label="Peak at"
            unit="s"
            value={signal.delay}
            optional
            min={0}
            placeholder={formatNumber(Number((1.5 / signal.peakFrequency).toPrecision(3)))}
            onCommit={(delay) => onCommit(delay === undefined ? { kind: "ricker", peakFrequency: signal.peakFrequency } : { ...signal, delay })}
          />
        </div>
      ) : null}
      {signal.kind === "gaussianPulse" ? (
        <div className="grid grid-cols-2 gap-2">
          <NumberField label="Width σ" unit="s" value={signal.width} min={0} exclusiveMin onCommit={required((width) => onCommit({ ...signal, width }))} />
          <NumberField
            label="Peak at"
            unit="s"
            value={signal.delay}
            optional
            min={0}
            placeholder={formatNumber(Number((6 * signal.width).toPrecision(3)))}
            onCommit={(delay) => onCommit(delay === undefined ? { kind: "gaussianPulse", width: signal.width } : { ...signal, delay })}
          />
        </div>
      ) : null}
      {signal.kind === "toneBurst" ? (
        <div className="grid grid-cols-2 gap-2">
          <NumberField label="Carrier" unit="Hz" value={signal.frequency} min={0} exclusiveMin onCommit={required((frequency) => onCommit({ ...signal, frequency }))} />
          <NumberField label="Cycles" value={signal.cycles} min={0} exclusiveMin max={1000} onCommit={required((cycles) => onCommit({ ...signal, cycles }))} />
        </div>
      ) : null}
      {signal.kind === "sine" ? (
        <div className="grid grid-cols-2 gap-2">
          <NumberField label="Frequency" unit="Hz" value={signal.frequency} min={0} exclusiveMin onCommit={required((frequency) => onCommit({ ...signal, frequency }))} />
          <NumberField label="Fade-in" unit="cycles" value={signal.rampCycles} min={0} max={1000} onCommit={required((rampCycles) => onCommit({ ...signal, rampCycles }))} />
        </div>
      ) : null}
      {signal.kind === "sampled" ? (
        <p className="text-[12.5px] text-ink-soft">
          {signal.samples.length.toLocaleString("en-GB")} samples at {formatNumber(signal.sampleRate)} Hz. Edit the samples in the code view.
        </p>
      ) : null}
      <p className={`rounded-md px-2.5 py-2 text-[12px] leading-snug ${aboveBand ? "bg-[#fdf6e7] text-ink-soft" : "bg-paper text-muted"}`} data-testid="signal-band">
        {Number.isFinite(upper) ? (
          <>
            Energy up to <span className="font-mono text-ink">{Math.round(upper)} Hz</span> (−30 dB);
          </>
        ) : (
          <>An abrupt start has energy at every frequency;</>
        )}{" "}
        the grid resolves <span className="font-mono text-ink">{Math.round(resolved)} Hz</span>.
        {aboveBand ? <span className="font-medium text-signal-warn"> Above the band: expect dispersion error.</span> : null}
      </p>
      <SignalPlot signal={signal} grid={grid} />
    </div>
  );
}
