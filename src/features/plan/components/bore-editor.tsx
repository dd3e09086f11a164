/**
 * Editing a bore's vertical profile and casing with live figures: grade, casing outside
 * diameter, and each profile point by station and elevation. Every change re-runs the shared
 * clearance engine in the browser; Save writes through the API with the version the designer
 * started from, Cancel puts everything back.
 */
import { useEffect, useState, type ChangeEvent } from 'react';
import type { LinearUnit, StationStyle } from '@shared/domain';
import type { BoreDto } from '@shared/api';
import { formatStation, parseStation, type BoreReport, type ShiftWindow } from '@shared/geometry';
import { UNIT_SYMBOLS } from '@shared/units';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { NumberField } from '@/components/ui/field';
import { FormActions } from '@/components/ui/form';
import { formatNumber } from '@/lib/format';
import { overallGrade, round, withOverallGrade } from '../lib/live';
import { STATUS_LABELS } from '../lib/styles';

export interface BoreEditorProps {
  draft: BoreDto;
  saved: BoreDto;
  liveReport: BoreReport | null;
  baseReport: BoreReport | null;
  unit: LinearUnit;
  datum: string;
  stationStyle: StationStyle;
  onChange: (next: BoreDto) => void;
  onSave: () => void;
  onCancel: () => void;
  saving: boolean;
  error: unknown;
  /** The bore as someone else saved it, after a 409. */
  theirs: BoreDto | null;
  onTakeTheirs: () => void;
  onKeepMine: () => void;
}

function parseNumber(text: string): number | null {
  const t = text.trim().replace(/\u2212/g, '-');
  if (!/^[-+]?(\d+(\.\d*)?|\.\d+)$/.test(t)) return null;
  const v = Number(t);
  return Number.isFinite(v) ? v : null;
}

/**
 * A number input that keeps what is typed until it parses and passes `problem`, then reports
 * the value through `commit`; while it has focus, outside changes of `value` do not overwrite
 * the text. Gives the input's props and the problem with what is typed, if any.
 */
function useNumberInput(value: number, decimals: number, problem: (v: number | null) => string | undefined, commit: (v: number) => void) {
  const [text, setText] = useState(() => formatNumber(value, decimals).replace(/,/g, ''));
  const [focused, setFocused] = useState(false);
  const [error, setError] = useState<string | undefined>();
  useEffect(() => {
    if (!focused) setText(formatNumber(value, decimals).replace(/,/g, ''));
  }, [value, decimals, focused]);
  const inputProps = {
    value: text,
    onFocus: () => setFocused(true),
    onBlur: () => setFocused(false),
    onChange: (e: ChangeEvent<HTMLInputElement>) => {
      setText(e.target.value);
      const v = parseNumber(e.target.value);
      const message = problem(v);
      setError(message);
      if (message === undefined && v !== null) commit(v);
    },
  };
  return { error, inputProps };
}

/** The profile in words for the stale-save choice: "10+00 @ 425.50, …". */
function profileText(profile: BoreDto['profile'], stationStyle: StationStyle): string {
  return profile.map((p) => `${formatStation(p.station, stationStyle)} @ ${formatNumber(p.elevation, 2)}`).join(', ');
}

function GradeField({ draft, onChange }: { draft: BoreDto; onChange: (b: BoreDto) => void }) {
  const grade = overallGrade(draft.profile);
  const { error, inputProps } = useNumberInput(
    round(grade, 3),
    3,
    (v) => (v === null ? 'must be a number, e.g. -0.5' : Math.abs(v) > 60 ? 'must be between -60 and 60 %' : undefined),
    (v) => onChange({ ...draft, profile: withOverallGrade(draft.profile, v) }),
  );
  return (
    <NumberField
      label="Grade"
      unit="%"
      hint="Overall grade, first to last profile point; changing it turns the profile about its first point. Negative falls up-station."
      error={error ? { message: error } : undefined}
      {...inputProps}
    />
  );
}

function CasingField({ draft, unit, onChange }: { draft: BoreDto; unit: LinearUnit; onChange: (b: BoreDto) => void }) {
  const { error, inputProps } = useNumberInput(
    draft.casingOd,
    3,
    (v) => (v === null || v <= 0 ? 'must be a number greater than zero' : undefined),
    (v) => onChange({ ...draft, casingOd: v }),
  );
  const usual = unit === 'm' ? `${formatNumber(draft.casingOd * 1000, 0)} mm` : `${formatNumber(draft.casingOd * 12, 1)} in`;
  return (
    <NumberField
      label="Casing outside diameter"
      unit={UNIT_SYMBOLS[unit]}
      hint={`${usual}; clearances are edge to edge from the casing (or reamed hole) outside.`}
      error={error ? { message: error } : undefined}
      {...inputProps}
    />
  );
}

function PointRow({ index, draft, unit, stationStyle, onChange }: { index: number; draft: BoreDto; unit: LinearUnit; stationStyle: StationStyle; onChange: (b: BoreDto) => void }) {
  const p = draft.profile[index]!;
  const [stationText, setStationText] = useState(() => formatStation(p.station, stationStyle));
  const [stationError, setStationError] = useState<string | null>(null);
  const elev = useNumberInput(
    p.elevation,
    2,
    (v) => (v === null ? 'must be a number' : undefined),
    (v) => setPoint(p.station, v),
  );
  useEffect(() => setStationText(formatStation(p.station, stationStyle)), [p.station, stationStyle]);
  const last = draft.profile.length - 1;
  const ends = index === 0 || index === last;
  const setPoint = (station: number, elevation: number) => {
    const profile = draft.profile.map((q, i) => (i === index ? { station, elevation } : q));
    onChange({ ...draft, profile });
  };
  return (
    <tr className="border-b border-ink-100 align-top last:border-b-0">
      <td className="py-1.5 pr-2 text-xs text-ink-500 tabular">{index + 1}</td>
      <td className="py-1.5 pr-2">
        <input
          aria-label={`Station of profile point ${index + 1}`}
          className="min-h-10 w-28 rounded-md border border-ink-300 px-2 text-sm tabular disabled:bg-ink-100"
          value={stationText}
          disabled={ends}
          title={ends ? 'The end points stay at the ends of the alignment' : undefined}
          onChange={(e) => setStationText(e.target.value)}
          onBlur={() => {
            try {
              const s = parseStation(stationText, stationStyle);
              const prev = draft.profile[index - 1];
              const next = draft.profile[index + 1];
              if ((prev && s <= prev.station) || (next && s >= next.station)) {
                setStationError(`must lie between ${prev ? formatStation(prev.station, stationStyle) : '—'} and ${next ? formatStation(next.station, stationStyle) : '—'}`);
                return;
              }
              setStationError(null);
              setPoint(s, p.elevation);
            } catch (e) {
              setStationError(e instanceof Error ? e.message : 'not a station');
            }
          }}
        />
        {stationError && <p className="mt-0.5 max-w-40 text-xs text-danger-700">Station: {stationError}</p>}
      </td>
      <td className="py-1.5 pr-2">
        <input
          aria-label={`Elevation of profile point ${index + 1}`}
          inputMode="decimal"
          className="min-h-10 w-24 rounded-md border border-ink-300 px-2 text-sm tabular"
          {...elev.inputProps}
        />
        {elev.error && <p className="mt-0.5 text-xs text-danger-700">Elevation: {elev.error}</p>}
      </td>
      <td className="py-1.5">
        {!ends && (
          <button
            type="button"
            className="min-h-10 rounded px-2 text-xs font-medium text-danger-700 hover:bg-danger-50"
            aria-label={`Remove profile point ${index + 1}`}
            onClick={() => onChange({ ...draft, profile: draft.profile.filter((_, i) => i !== index) })}
          >
            Remove
          </button>
        )}
      </td>
    </tr>
  );
}

/** The bore window in words: how far the whole profile may move and keep every crossed line clear. */
function describeWindow(shift: ShiftWindow, u: string): string {
  const head = 'Bore window (requirement + allowance): ';
  if (shift.empty) return `${head}no vertical shift of the whole profile clears every crossed line.`;
  const eps = 0.005;
  const f = (v: number) => `${formatNumber(Math.abs(v), 2)} ${u}`;
  if (shift.down !== null && shift.down > eps) return `${head}the profile must rise by at least ${f(shift.down)}${shift.up !== null ? ` and at most ${f(shift.up)}` : ''}.`;
  if (shift.up !== null && shift.up < -eps) return `${head}the profile must drop by at least ${f(shift.up)}${shift.down !== null ? ` and at most ${f(shift.down)}` : ''}.`;
  const down = shift.down === null ? 'without limit' : `by up to ${f(shift.down)}`;
  const up = shift.up === null ? 'without limit' : `by up to ${f(shift.up)}`;
  return `${head}it may drop ${down} and rise ${up}${shift.upGovernedByCover ? ' (minimum cover limits the rise)' : ''}.`;
}

/** A new point in the middle of the longest stretch of the profile. */
function addPoint(draft: BoreDto): BoreDto {
  let best = 1;
  for (let i = 1; i < draft.profile.length; i++) {
    if (draft.profile[i]!.station - draft.profile[i - 1]!.station > draft.profile[best]!.station - draft.profile[best - 1]!.station) best = i;
  }
  const a = draft.profile[best - 1]!;
  const b = draft.profile[best]!;
  const mid = { station: round((a.station + b.station) / 2, 2), elevation: round((a.elevation + b.elevation) / 2, 2) };
  return { ...draft, profile: [...draft.profile.slice(0, best), mid, ...draft.profile.slice(best)] };
}

export function BoreEditor(props: BoreEditorProps) {
  const { draft, saved, liveReport, baseReport, unit, datum, stationStyle, onChange, onSave, onCancel, saving, error, theirs } = props;
  const u = UNIT_SYMBOLS[unit];
  const before = new Map(baseReport?.lines.map((l) => [l.lineId, l.status]) ?? []);
  const changes = (liveReport?.lines ?? []).filter((l) => before.get(l.lineId) !== undefined && before.get(l.lineId) !== l.status);
  const dirty = JSON.stringify(draft.profile) !== JSON.stringify(saved.profile) || draft.casingOd !== saved.casingOd;
  const shift = liveReport?.window?.withAllowance.shift ?? null;

  return (
    <section aria-label={`Editing ${draft.name}`} className="space-y-3 rounded-lg border-2 border-sky-300 bg-white p-4 print:hidden" data-testid="bore-editor">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-base font-semibold">Editing {draft.name}</h3>
        <p className="text-xs text-ink-500">Figures recompute as you type or drag a point in the profile.</p>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <GradeField draft={draft} onChange={onChange} />
        <CasingField draft={draft} unit={unit} onChange={onChange} />
      </div>
      <div>
        <table className="text-sm">
          <caption className="mb-1 text-left text-sm font-medium text-ink-800">
            Profile points (casing centreline, elevations in {u} {datum})
          </caption>
          <thead className="text-left text-xs text-ink-500">
            <tr>
              <th className="pr-2 font-medium">#</th>
              <th className="pr-2 font-medium">Station</th>
              <th className="pr-2 font-medium">Elevation, {u}</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {draft.profile.map((_, i) => (
              <PointRow key={`${i}-${draft.profile.length}`} index={i} draft={draft} unit={unit} stationStyle={stationStyle} onChange={onChange} />
            ))}
          </tbody>
        </table>
        <Button variant="ghost" size="sm" className="mt-1" onClick={() => onChange(addPoint(draft))} disabled={draft.profile.length >= 50}>
          Add a profile point
        </Button>
      </div>

      <div className="rounded-md bg-ink-50 px-3 py-2 text-sm" aria-live="polite" data-testid="edit-summary">
        {liveReport && !liveReport.computed ? (
          <p className="text-danger-700">The engine cannot use this profile: {liveReport.error?.message}</p>
        ) : changes.length === 0 ? (
          <p className="text-ink-600">{dirty ? 'No line changes status with this edit.' : 'No changes yet.'}</p>
        ) : (
          <ul className="space-y-0.5">
            {changes.map((l) => (
              <li key={l.lineId}>
                <span className="font-medium">{l.label}</span>: {STATUS_LABELS[before.get(l.lineId)!]} → <strong>{STATUS_LABELS[l.status]}</strong>
              </li>
            ))}
          </ul>
        )}
        {shift && <p className="mt-1 text-xs text-ink-600 tabular">{describeWindow(shift, u)}</p>}
      </div>

      {theirs ? (
        <Alert tone="caution" title="Not saved: someone else saved this bore first">
          <p>
            Their profile: {profileText(theirs.profile, stationStyle)}; casing{' '}
            {formatNumber(theirs.casingOd, 3)} {u} (version {theirs.version}).
          </p>
          <p>
            Yours: {profileText(draft.profile, stationStyle)}; casing {formatNumber(draft.casingOd, 3)} {u}.
          </p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button size="sm" variant="secondary" onClick={props.onTakeTheirs}>
              Use their version
            </Button>
            <Button size="sm" onClick={props.onKeepMine}>
              Keep mine and save over theirs
            </Button>
          </div>
        </Alert>
      ) : (
        error != null && <ProblemAlert error={error} />
      )}

      <FormActions
        submitLabel="Save bore"
        onSubmit={onSave}
        busy={saving}
        submitDisabled={!dirty || (liveReport != null && !liveReport.computed) || theirs != null}
        onCancel={onCancel}
        cancelDisabled={saving}
      />
    </section>
  );
}
