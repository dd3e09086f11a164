/**
 * Live clearances while a designer edits a bore: the lines, holes and rules are prepared once
 * (scene and segment index), and each edit re-runs only the edited bore through the shared
 * engine — the same code the server runs when the bore is saved.
 */
import { analyseBore, buildSegmentIndex, prepareScene, type BoreInput, type BoreReport, type ClearanceInput, type Scene } from '@shared/geometry';
import type { BoreDto, ClearanceRuleDto, HoleDto, LineDto, PitDto } from '@shared/api';
import type { LinearUnit } from '@shared/domain';
import type { ProjectSettings } from '@shared/schemas/project';

/** A prepared project: lines, holes and rules, ready for any bore. */
export interface LiveScene {
  scene: Scene;
  index: ReturnType<typeof buildSegmentIndex>;
}

export function prepareLiveScene(input: {
  unit: LinearUnit;
  settings: ProjectSettings;
  rules: readonly ClearanceRuleDto[];
  lines: readonly LineDto[];
  holes: readonly HoleDto[];
}): LiveScene {
  const clearanceInput: ClearanceInput = { unit: input.unit, settings: input.settings, rules: input.rules, bores: [], lines: input.lines, holes: input.holes };
  const scene = prepareScene(clearanceInput);
  return { scene, index: buildSegmentIndex(scene.store) };
}

/** The engine's view of a bore with its pits. */
export function boreInputOf(bore: BoreDto, pits: readonly PitDto[]): BoreInput {
  return { ...bore, pits: pits.filter((p) => p.boreId === bore.id) };
}

/** Every figure of one bore against the prepared lines; a bore the engine cannot use yields a report with `computed: false`. */
export function liveBoreReport(live: LiveScene, bore: BoreDto, pits: readonly PitDto[]): BoreReport {
  try {
    return analyseBore(live.scene, boreInputOf(bore, pits), live.index);
  } catch (e) {
    return {
      boreId: bore.id, name: bore.name, computed: false,
      error: { code: 'BORE_INVALID', message: e instanceof Error ? e.message : String(e), boreId: bore.id },
      length: null, beginStation: bore.beginStation, endStation: null, casingRadius: null, cover: null, lines: [], pitConflicts: [],
      suggestedHoles: [], window: null, counts: { overlap: 0, conflict: 0, marginal: 0, unverified: 0, clear: 0 }, warnings: [],
    };
  }
}

/** Overall grade of a profile in percent (first to last point). */
export function overallGrade(profile: readonly { station: number; elevation: number }[]): number {
  const a = profile[0];
  const b = profile[profile.length - 1];
  if (!a || !b || b.station === a.station) return 0;
  return ((b.elevation - a.elevation) / (b.station - a.station)) * 100;
}

/** Turn the whole profile about its first point so its overall grade becomes `gradePercent`. */
export function withOverallGrade<P extends { station: number; elevation: number }>(profile: readonly P[], gradePercent: number): P[] {
  const first = profile[0];
  if (!first) return [...profile];
  const delta = (gradePercent - overallGrade(profile)) / 100;
  return profile.map((p) => ({ ...p, elevation: round(p.elevation + delta * (p.station - first.station), 4) }));
}

export function round(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}
