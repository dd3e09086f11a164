import type { BoreMethod, LinearUnit } from './domain';
import type { ProjectSettings } from './schemas/project';
import { convertLength } from './units';

/**
 * Default project settings, converted into the project's unit. All are editable presets.
 * - Location uncertainty by quality level: A 0.1 ft (ASCE 38-22 draft wording, from memory);
 *   B 1 ft, C 3 ft, D 5 ft are assumptions of common practice for designated/record lines.
 * - Verification distance 10 ft: a hole within about one pothole-spacing of the crossing (common practice).
 * - Phone fixes worse than 16 ft (~5 m) are refused (common practice for consumer GNSS).
 */
export function defaultProjectSettings(unit: LinearUnit): ProjectSettings {
  const ft = (v: number) => round(convertLength(v, 'ft', unit));
  return {
    verificationDistance: ft(10),
    qualityLevelUncertainty: { A: ft(0.1), B: ft(1), C: ft(3), D: ft(5) },
    extrapolationFactor: 0.02,
    maxGpsAccuracy: ft(16),
  };
}

/**
 * Default construction tolerance (horizontal, vertical) by bore method, in feet.
 * Microtunnel ±1 in line and grade (common specification); auger bore about 1% of length
 * (common practice, from memory) — here a flat 1 ft; directional drill: job-specific, 2 ft default.
 */
export const DEFAULT_TOLERANCE_FT: Record<BoreMethod, { horizontal: number; vertical: number }> = {
  microtunnel: { horizontal: 1 / 12, vertical: 1 / 12 },
  auger_bore: { horizontal: 1, vertical: 1 },
  pipe_ramming: { horizontal: 1, vertical: 1 },
  hdd: { horizontal: 2, vertical: 2 },
  open_cut: { horizontal: 0.5, vertical: 0.25 },
};

function round(v: number): number {
  return Math.round(v * 1000) / 1000;
}
