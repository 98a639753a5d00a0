"use client";
// Grouped bars per frequency band (band levels, insertion loss): one bar per receiver in each band,
// labelled with the nominal centre; hovering a bar names its exact band edges and value. SVG rather than
// uPlot: the x axis is a list of bands, not a continuous quantity, and each bar carries its own title.
import type { Ref } from "react";

import { USE_WITH_CARE_MARK } from "@/lib/analysis/accuracy";
import type { FrequencyBand } from "@/lib/analysis/bands";

export interface BarGroup {
  label: string;
  colour: string;
  /** One value per band; NaN or infinite values draw no bar. */
  values: ArrayLike<number>;
}

export interface BandBarChartProps {
  bands: readonly FrequencyBand[];
  groups: readonly BarGroup[];
  /** "dB re 20 µPa", "dB". */
  unit: string;
  /** Axis title. */
  quantity: string;
  /** Bars grow from 0 (insertion loss, which may be negative) or from the bottom of the range (levels). */
  fromZero?: boolean;
  ariaLabel: string;
  svgRef?: Ref<SVGSVGElement>;
  /** Bands the accuracy estimate rates "use with care" (bandsToUseWithCare: index to reason): their label carries a mark. */
  careful?: ReadonlyMap<number, string>;
}

const WIDTH = 760;
/** The signal-warn colour of the theme, written out: exported PNGs carry no stylesheet. */
const CAUTION_COLOUR = "#b7791f";
const HEIGHT = 260;
const MARGIN = { left: 52, right: 10, top: 12, bottom: 40 };

export function formatHz(frequency: number): string {
  return frequency >= 1000 ? `${Number((frequency / 1000).toPrecision(4))} kHz` : `${Number(frequency.toPrecision(4))} Hz`;
}

/** Tick step of 1, 2 or 5 times a power of ten giving about five ticks. */
function tickStep(span: number): number {
  const raw = span / 5;
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  const mantissa = raw / power;
  return (mantissa <= 1 ? 1 : mantissa <= 2 ? 2 : mantissa <= 5 ? 5 : 10) * power;
}

function valueRange(groups: readonly BarGroup[], fromZero: boolean): [number, number] {
  let low = Infinity;
  let high = -Infinity;
  for (const group of groups) {
    for (let i = 0; i < group.values.length; i++) {
      const value = group.values[i] ?? NaN;
      if (!Number.isFinite(value)) continue;
      low = Math.min(low, value);
      high = Math.max(high, value);
    }
  }
  if (!Number.isFinite(low)) return [0, 1];
  if (fromZero) {
    low = Math.min(0, low);
    high = Math.max(0, high);
  } else {
    low -= 10;
  }
  if (high - low < 1) high = low + 1;
  const step = tickStep(high - low);
  return [Math.floor(low / step) * step, Math.ceil(high / step) * step];
}

export function BandBarChart({ bands, groups, unit, quantity, fromZero = false, ariaLabel, svgRef, careful }: BandBarChartProps) {
  const [low, high] = valueRange(groups, fromZero);
  const plotWidth = WIDTH - MARGIN.left - MARGIN.right;
  const plotHeight = HEIGHT - MARGIN.top - MARGIN.bottom;
  const y = (value: number) => MARGIN.top + plotHeight * (1 - (value - low) / (high - low));
  const slot = plotWidth / Math.max(1, bands.length);
  const barWidth = Math.max(1, (slot * 0.8) / Math.max(1, groups.length));
  const step = tickStep(high - low);
  const ticks: number[] = [];
  for (let t = low; t <= high + step / 2; t += step) ticks.push(Number(t.toPrecision(10)));
  const base = fromZero ? y(0) : y(low);
  // Thin out the band labels so that they never overlap (about 34 px each).
  const labelEvery = Math.max(1, Math.ceil(34 / slot));

  return (
    <svg ref={svgRef} viewBox={`0 0 ${WIDTH} ${HEIGHT}`} className="h-auto w-full max-w-3xl font-mono" role="img" aria-label={careful && careful.size > 0 ? `${ariaLabel}; ${careful.size} band${careful.size === 1 ? "" : "s"} marked use with care` : ariaLabel} data-testid="band-bar-chart">
      <rect x={0} y={0} width={WIDTH} height={HEIGHT} fill="#ffffff" />
      {ticks.map((tick) => (
        <g key={tick}>
          <line x1={MARGIN.left} x2={WIDTH - MARGIN.right} y1={y(tick)} y2={y(tick)} stroke="#efede6" />
          <text x={MARGIN.left - 6} y={y(tick)} textAnchor="end" dominantBaseline="middle" fontSize={11} fill="#66717c">
            {tick}
          </text>
        </g>
      ))}
      <text transform={`translate(12 ${MARGIN.top + plotHeight / 2}) rotate(-90)`} textAnchor="middle" fontSize={11} fill="#66717c">
        {quantity} ({unit})
      </text>
      {bands.map((band, b) => {
        const reason = careful?.get(band.index);
        const caution = reason ? `. Use with care: ${reason}` : "";
        return (
          <g key={band.index}>
            {groups.map((group, g) => {
              const value = group.values[b] ?? NaN;
              if (!Number.isFinite(value)) return null;
              const top = Math.min(y(value), base);
              const x = MARGIN.left + b * slot + slot * 0.1 + g * barWidth;
              return (
                <rect key={g} x={x} y={top} width={Math.max(1, barWidth - 1)} height={Math.max(0.5, Math.abs(y(value) - base))} fill={group.colour}>
                  <title>{`${group.label} · ${formatHz(band.nominal)} band (exact edges ${band.lower.toFixed(1)}–${band.upper.toFixed(1)} Hz, centre ${band.centre.toFixed(1)} Hz): ${value.toFixed(1)} ${unit}${caution}`}</title>
                </rect>
              );
            })}
            {b % labelEvery === 0 || reason ? (
              <text x={MARGIN.left + (b + 0.5) * slot} y={HEIGHT - MARGIN.bottom + 14} textAnchor="middle" fontSize={11} fill="#66717c">
                <title>{`exact edges ${band.lower.toFixed(1)}–${band.upper.toFixed(1)} Hz${caution}`}</title>
                {/* A marked band whose label is thinned out keeps the mark alone, so that no caution is lost. */}
                {b % labelEvery === 0 ? (band.nominal >= 1000 ? `${Number((band.nominal / 1000).toPrecision(3))}k` : band.nominal) : null}
                {reason ? <tspan fill={CAUTION_COLOUR}>{USE_WITH_CARE_MARK}</tspan> : null}
              </text>
            ) : null}
          </g>
        );
      })}
      <line x1={MARGIN.left} x2={WIDTH - MARGIN.right} y1={base} y2={base} stroke="#66717c" />
      <text x={MARGIN.left + plotWidth / 2} y={HEIGHT - 6} textAnchor="middle" fontSize={11} fill="#66717c">
        Band, nominal centre frequency (Hz)
      </text>
    </svg>
  );
}
