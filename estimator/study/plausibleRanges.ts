// Plausible ranges of the impairments a landing study asks about: from "good" to "bad" in
// the units of the scenario file. Defaults for sensitivity ranking and requirement finding;
// users override them with --vary PATH=FROM:TO.

export interface PlausibleRange {
  path: string;
  /** The good end and the bad end of the range. */
  from: number;
  to: number;
}

/** Small-multirotor, onboard-detector values (common practice, not a source of record). */
export const PLAUSIBLE_RANGES: readonly PlausibleRange[] = [
  { path: 'detector.pixelNoise', from: 0.5, to: 8 },
  { path: 'detector.sizeNoise', from: 0, to: 0.15 },
  { path: 'detector.latency', from: 0.02, to: 0.5 }, // onboard detectors on small computers reach 0.3-0.5 s (common practice)
  { path: 'detector.rate', from: 30, to: 5 },
  { path: 'detector.dropout', from: 0, to: 0.5 },
  { path: 'detector.falseBoxRate', from: 0, to: 2 },
  { path: 'localization.attitudeBiasDeg', from: 0, to: 3 },
  { path: 'localization.odometryBias', from: 0, to: 0.3 },
  { path: 'localization.odometryNoise', from: 0.02, to: 0.3 },
  { path: 'localization.misalignmentDeg', from: 0, to: 3 },
  { path: 'localization.focalError', from: 0, to: 0.05 },
  { path: 'localization.targetSizeError', from: 0, to: 0.2 },
  { path: 'localization.clockOffset', from: 0, to: 0.05 },
  { path: 'lander.wind.speed', from: 0, to: 8 },
  { path: 'carrier.speed', from: 1, to: 8 },
];

export function plausibleRange(path: string): PlausibleRange | undefined {
  return PLAUSIBLE_RANGES.find((r) => r.path === path);
}
