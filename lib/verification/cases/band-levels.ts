// Case 7: band levels from an FFT (bin energies summed per band, Parseval) of a signal whose band levels
// are known in closed form: in each one-third octave band a sine at the midband frequency and a quieter one
// just inside the lower band edge (so a band edge in the wrong place would show).
import { bandLevelsOfSteadySignal, bandsBetween, frequencyBand, levelFromMeanSquare, REFERENCE_PRESSURE } from "../../analysis/bands";
import { blackmanHarrisWindow } from "../../analysis/windows";
import { clockSeconds, decimateSeries, makeCheck, makeCurve, makeOutcome, pointSeries } from "./outcome";
import type { VerificationCase, VerificationCheck } from "./types";

const SAMPLE_RATE = 48000;
/** 2 s: 96000 samples, zero-padded to 131072; the lowest band (50 Hz) is 23 natural bins wide. */
const DURATION = 2;
const LOWEST_BAND = 50;
const HIGHEST_BAND = 10000;

/** Notes: band levels from an FFT agree with a direct computation to a few hundredths of a dB. */
const BAND_LEVEL_TOLERANCE_DB = 0.03;

/** Where the second sine of a band sits: 6% above its lower edge (at 50 Hz still 5 bins, beyond the window's main lobe). */
const NEAR_EDGE_FACTOR = 1.06;
/** The second sine is this much quieter than the first, dB. */
const NEAR_EDGE_OFFSET_DB = -6;

/** Level of the midband sine in one-third octave band number x, dB re 20 uPa: a spread of 40 dB, so leakage between bands would show. */
function sineLevel(index: number): number {
  return 50 + 40 * (0.5 + 0.5 * Math.sin(1.7 * index));
}

const amplitudeOfLevel = (level: number) => Math.SQRT2 * REFERENCE_PRESSURE * Math.pow(10, level / 20);

function run(options?: Parameters<VerificationCase["run"]>[0]) {
  const started = clockSeconds();
  options?.onProgress?.({ fraction: 0, stage: "synthesising the signal" });
  const timeStep = 1 / SAMPLE_RATE;
  const count = Math.round(DURATION * SAMPLE_RATE);
  const thirds = bandsBetween(LOWEST_BAND, HIGHEST_BAND, 3);
  const signal = new Float64Array(count);
  // A sine of amplitude A has mean square A^2 / 2; sines of different frequencies add in mean square.
  const bandMeanSquares = thirds.map(() => 0);
  thirds.forEach((band, b) => {
    const sines = [
      { frequency: band.centre, amplitude: amplitudeOfLevel(sineLevel(band.index)) },
      { frequency: band.lower * NEAR_EDGE_FACTOR, amplitude: amplitudeOfLevel(sineLevel(band.index) + NEAR_EDGE_OFFSET_DB) },
    ];
    sines.forEach((sine, s) => {
      const omega = 2 * Math.PI * sine.frequency;
      // Phases spread by the golden angle so that the peaks of the sines do not line up.
      const phase = 2.39996 * (2 * b + s);
      for (let n = 0; n < count; n++) signal[n]! += sine.amplitude * Math.sin(omega * n * timeStep + phase);
      bandMeanSquares[b]! += (sine.amplitude * sine.amplitude) / 2;
    });
  });

  options?.onProgress?.({ fraction: 0.5, stage: "band levels" });
  // Sidelobes 92 dB down beyond 4 bins: a loud band leaks nothing measurable into a quiet neighbour.
  const window = blackmanHarrisWindow(count);
  const checks: VerificationCheck[] = [];
  const thirdLevels = bandLevelsOfSteadySignal(signal, timeStep, thirds, window);
  thirds.forEach((band, b) => {
    checks.push(makeCheck(`one-third octave ${band.nominal} Hz: FFT band level against the energy sum of its two sines`, thirdLevels[b]!, levelFromMeanSquare(bandMeanSquares[b]!), BAND_LEVEL_TOLERANCE_DB, "dB"));
  });
  // Base-10 octave band x holds the one-third octaves 3x - 1, 3x and 3x + 1, edge to edge (IEC 61260-1).
  const octaves = bandsBetween(frequencyBand(thirds[0]!.index + 1, 3).centre, frequencyBand(thirds[thirds.length - 1]!.index - 1, 3).centre, 1);
  const octaveLevels = bandLevelsOfSteadySignal(signal, timeStep, octaves, window);
  octaves.forEach((octave, b) => {
    let meanSquare = 0;
    thirds.forEach((third, t) => {
      if (Math.abs(third.index - 3 * octave.index) <= 1) meanSquare += bandMeanSquares[t]!;
    });
    checks.push(makeCheck(`octave ${octave.nominal} Hz: FFT band level against the energy sum of its six sines`, octaveLevels[b]!, levelFromMeanSquare(meanSquare), BAND_LEVEL_TOLERANCE_DB, "dB"));
  });

  const centres = thirds.map((band) => band.nominal);
  const curves = [
    makeCurve("One-third octave band levels of a sum of sines", "one-third octave band (Hz)", "level (dB re 20 uPa)", [
      pointSeries("from the FFT", "simulated", centres, Array.from(thirdLevels)),
      decimateSeries("energy sum of the band's sines", "exact", centres, bandMeanSquares.map(levelFromMeanSquare)),
    ]),
  ];
  options?.onProgress?.({ fraction: 1, stage: "done" });
  return makeOutcome(checks, curves, started);
}

export const bandLevelsCase: VerificationCase = {
  id: "band-levels",
  title: "Band levels of a known signal",
  whatIsChecked:
    "A 2 s signal sampled at 48 kHz holds, in every one-third octave band from 50 Hz to 10 kHz, a sine at the exact midband frequency and one 6 dB quieter just inside the lower band edge; levels spread over 40 dB from band to band. Its band levels, computed from a Blackman-Harris-windowed FFT by summing bin energies per band (Parseval, window power gain removed), are compared with the energy sum of the sines in each band, A^2 / 2 per sine, in one-third octave and in octave bands.",
  reference: {
    name: "Mean square of a sine A^2/2; band edges fm G^(+-1/(2b)) with G = 10^(3/10), fm = 1000 G^(x/b) Hz",
    source: "IEC 61260-1:2014, clause 5 (base-10 octave ratio, midband frequencies and band edges; clause numbers from memory); ISO 266:1997 (preferred frequencies); Parseval's relation for the DFT (Oppenheim & Schafer, Discrete-Time Signal Processing, ch. 8; chapter from memory)",
  },
  resolution: `${SAMPLE_RATE / 1000} kHz sampling, ${DURATION} s record (0.5 Hz bins), Blackman-Harris window`,
  run,
};
