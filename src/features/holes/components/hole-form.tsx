import { useEffect, useMemo, useRef, useState } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type FieldErrors, type Resolver } from 'react-hook-form';
import type { BoreDto, HoleDto, LineDto, ProjectDto } from '@shared/api';
import { LINE_KIND_LABELS, type Role } from '@shared/domain';
import { pointAtStationOffset, pointPolylineDistance } from '@shared/geometry';
import { NEW_LINE_STUB_HALF_METRES, holeCreateSchema, type HoleCreateInput, type HoleUpdateInput } from '@shared/schemas/hole';
import { UNIT_SYMBOLS, convertLength } from '@shared/units';
import { SafetyCautions } from '@/components/safety-cautions';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { isApiError } from '@/lib/api-client';
import { asNumberOrNull, fieldMessage, formErrorMap } from '@/lib/form';
import { formatCoordinate, formatDateTime, formatLength, formatSize } from '@/lib/format';
import { keepHole } from '@/features/outbox/outbox-store';
import { useCreateHole } from '../api/create-hole';
import { staleHoleOf, useUpdateHole } from '../api/update-hole';
import { useGpsFix } from '../hooks/use-gps-fix';
import { parseBearing } from '../utils/bearing';
import { newClientId } from '../utils/client-id';
import { HOLE_FIELD_LABELS, describePosition, formatHoleField, type FieldContext } from '../utils/hole-fields';
import {
  NEW_LINE,
  POSITION_KEYS,
  boreById,
  emptyHoleValues,
  holeToValues,
  toCreateInput,
  toUpdateInput,
  type HoleFormValues,
} from '../utils/hole-form-values';
import { nextHoleNumber } from '../utils/next-number';
import { FormSection, MeasureField, SegmentedChoice } from './form-controls';
import { StaleChoice, type StaleRow } from './stale-choice';

const schemaResolver = zodResolver(holeCreateSchema, { error: formErrorMap });

/** Schema paths → form fields where the form shows a field under another name. */
/** A phone fix farther than this from every line and bore is flagged (common practice: a test hole sits on a located line). */
const FAR_FROM_PROJECT_METRES = 300;

const FIELD_OF_PATH: Record<string, keyof HoleFormValues> = { lineId: 'lineChoice', newLine: 'lineChoice', 'newLine.label': 'newLineLabel', station: 'stationText' };

type Mode = { kind: 'create' } | { kind: 'edit'; hole: HoleDto };

interface Props {
  project: ProjectDto;
  role: Role;
  userName: string;
  lines: LineDto[];
  bores: BoreDto[];
  holes: HoleDto[];
  mode: Mode;
  onSaved: (hole: HoleDto, how: 'created' | 'updated' | 'unchanged') => void;
  onCancel?: () => void;
  /** When given, a new hole that cannot reach the server is kept in the phone's outbox and this is called with its client id. */
  onKept?: (clientId: string) => void;
}

/**
 * The test-hole logging form, phone first: the line, the position (grid, station/offset on a
 * bore, or the phone's GPS), depth and elevation, the line as found, and the digging record.
 * Checked with the shared create schema; a create carries a client-made id kept across retries.
 */
export function HoleForm({ project, role, userName, lines, bores, holes, mode, onSaved, onCancel, onKept }: Props) {
  const unit = UNIT_SYMBOLS[project.unit];
  const datum = project.verticalDatum;
  const style = project.stationStyle;
  const editing = mode.kind === 'edit' ? mode.hole : null;
  const [base, setBase] = useState<HoleDto | null>(editing);
  const clientId = useRef(newClientId());
  const [stale, setStale] = useState<{ current: HoleDto; body: HoleUpdateInput } | null>(null);
  const [nothingChanged, setNothingChanged] = useState(false);
  const create = useCreateHole(project.id);
  const update = useUpdateHole(project.id, editing?.id ?? 0);
  const gps = useGpsFix(project);
  // Anyone logging a hole may add the line on no record it exposed (it is made with the hole,
  // also from the outbox); an edit changes the line only to one on record.
  const canAddLine = editing == null;

  const defaults = useMemo(
    () =>
      editing
        ? holeToValues(editing, style)
        : emptyHoleValues(
            nextHoleNumber(holes.map((h) => h.number)),
            role === 'field' ? userName : '',
          ),
    // Defaults are read once; the form keeps its own state after that.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [],
  );

  const resolver: Resolver<HoleFormValues, unknown, HoleCreateInput> = async (values, context, options) => {
    const { input, errors: extra } = toCreateInput(values, clientId.current, style);
    const result = await schemaResolver(input, context, options as never);
    const errors: Record<string, { type: string; message: string }> = {};
    for (const [path, error] of Object.entries(result.errors as FieldErrors)) {
      // The new line's label comes back nested under newLine.
      const nested = path === 'newLine' && error && !error.message ? (error as unknown as Record<string, { type?: unknown; message?: unknown } | undefined>).label : undefined;
      const field = FIELD_OF_PATH[nested ? 'newLine.label' : path] ?? path;
      const e = nested ?? error;
      if (e?.message) errors[field] = { type: String(e.type ?? 'schema'), message: String(e.message) };
    }
    for (const [field, message] of Object.entries(extra)) errors[field] = { type: 'custom', message };
    // The schema checks the position only once every field has its type, so a first save with
    // no line would hide the position's problems: say them at once.
    const need = (field: keyof HoleFormValues, message = 'is required') => {
      if (!errors[field]) errors[field] = { type: 'custom', message };
    };
    if (values.positionSource === 'station') {
      if (!values.boreId) need('boreId', 'choose the bore the station is on');
      if (!values.stationText.trim()) need('stationText');
      if (values.offset == null) need('offset');
      else if (values.offset > 0 && !values.offsetSide) need('offsetSide', 'is required: choose L or R');
    } else if (values.positionSource !== 'gps') {
      if (values.easting == null) need('easting');
      if (values.northing == null) need('northing');
    }
    if (values.positionSource === 'gps') {
      delete errors.easting;
      delete errors.northing;
      delete errors.gpsAccuracy;
      if (values.easting == null || values.northing == null || values.gpsAccuracy == null) errors.gpsAccuracy = { type: 'custom', message: 'has no fix yet: press “Use my position” and wait for a fix' };
      else if (values.gpsAccuracy != null && values.gpsAccuracy > project.settings.maxGpsAccuracy) {
        errors.gpsAccuracy = {
          type: 'custom',
          message: `±${formatLength(values.gpsAccuracy, project.unit, 1)} is worse than this project’s limit of ±${formatLength(project.settings.maxGpsAccuracy, project.unit, 1)}. Wait for a better fix in the open, or enter the position by grid or station.`,
        };
      }
    }
    if (values.lineChoice === NEW_LINE) {
      delete errors.lineChoice;
      if (!values.newLineLabel.trim()) errors.newLineLabel = { type: 'custom', message: 'is required' };
      if (parseBearing(values.direction) == null)
        errors.direction = { type: 'custom', message: 'is needed to draw the new line: write a bearing such as N 83° E, an azimuth such as 83, or E-W' };
      if (values.depthToTop == null) errors.depthToTop = { type: 'custom', message: 'is needed to place the new line in depth' };
      const sized = values.sizeShape === 'box' ? values.boxWidth != null && values.boxHeight != null : values.measuredSize != null;
      if (!sized) errors[values.sizeShape === 'box' ? 'boxWidth' : 'measuredSize'] = { type: 'custom', message: 'is needed to add the new line' };
    }
    if (Object.keys(errors).length > 0) return { values: {}, errors: errors as FieldErrors<HoleFormValues> };
    return { values: result.values as HoleCreateInput, errors: {} };
  };

  const {
    register,
    handleSubmit,
    watch,
    setValue,
    setError,
    reset,
    getValues,
    formState: { errors, isSubmitting, submitCount },
  } = useForm<HoleFormValues, unknown, HoleCreateInput>({ defaultValues: defaults, resolver, mode: 'onTouched' });

  const source = watch('positionSource');
  const lineChoice = watch('lineChoice');
  const sizeShape = watch('sizeShape');
  const boreId = watch('boreId');
  const measuredSize = watch('measuredSize');
  const gpsAccuracy = watch('gpsAccuracy');
  // Watched so the "lands at" line follows the station entry as it is typed.
  watch(['stationText', 'offset', 'offsetSide']);

  const lineById = useMemo(() => new Map(lines.map((l) => [l.id, l])), [lines]);
  const fieldCtx: FieldContext = {
    unit: project.unit,
    datum,
    stationStyle: style,
    lineLabel: (id) => lineById.get(id)?.label ?? `line ${id}`,
    boreName: (id) => bores.find((b) => b.id === id)?.name ?? `bore ${id}`,
  };

  const num = { setValueAs: asNumberOrNull };

  /** Where a station/offset entry lands, as the server will compute it. */
  let stationPreview: { text: string; warn: boolean } | null = null;
  if (source === 'station') {
    const bore = boreById(bores, boreId);
    const v = getValues();
    const parsed = toCreateInput(v, clientId.current, style).input;
    if (bore && parsed.station != null && !Number.isNaN(parsed.station) && v.offset != null && !Number.isNaN(v.offset)) {
      try {
        const p = pointAtStationOffset(bore.alignment, bore.beginStation, parsed.station, v.offset, v.offsetSide || 'R');
        stationPreview = {
          text: `Lands at E ${formatCoordinate(p.easting, project.unit)}, N ${formatCoordinate(p.northing, project.unit)}${
            p.beyond ? `, ${formatLength(p.distanceBeyond, project.unit)} past the ${p.beyond === 'start' ? 'start' : 'end'} of the bore` : ''
          }.`,
          warn: p.beyond != null,
        };
      } catch {
        stationPreview = null;
      }
    }
  }

  const gpsFix = gps.state.phase === 'idle' ? null : gps.state.best;
  // A phone fix far from every line and bore of the project is not at a hole of this project
  // (a stale fix, a phone left in the truck, the wrong project open): say so before it is saved.
  const farFromProject = useMemo(() => {
    if (!gpsFix) return null;
    const here = [gpsFix.easting, gpsFix.northing] as const;
    const nearest = Math.min(...lines.map((l) => pointPolylineDistance(here, l.path)), ...bores.map((b) => pointPolylineDistance(here, b.alignment)));
    return Number.isFinite(nearest) && nearest > convertLength(FAR_FROM_PROJECT_METRES, 'm', project.unit) ? nearest : null;
  }, [gpsFix, lines, bores, project.unit]);
  const useFix = () => {
    gps.start(project.settings.maxGpsAccuracy / 2);
  };
  // A position keeps its source: coordinates from a phone fix are never left behind as typed
  // grid values, and typed values never pass for a fix.
  const previousSource = useRef(source);
  useEffect(() => {
    const before = previousSource.current;
    previousSource.current = source;
    if (before === source || (before !== 'gps' && source !== 'gps')) return;
    const fix = source === 'gps' && gps.state.phase !== 'idle' ? gps.state.best : null;
    setValue('easting', fix ? Math.round(fix.easting * 1000) / 1000 : null);
    setValue('northing', fix ? Math.round(fix.northing * 1000) / 1000 : null);
    setValue('gpsAccuracy', fix ? Math.max(0.01, Math.round(fix.accuracy * 100) / 100) : null);
    if (before === 'gps') gps.stop();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [source]);

  // Copy the best fix into the form whenever it improves.
  const fixAt = gpsFix?.at;
  useEffect(() => {
    if (!gpsFix || getValues('positionSource') !== 'gps') return;
    setValue('easting', Math.round(gpsFix.easting * 1000) / 1000);
    setValue('northing', Math.round(gpsFix.northing * 1000) / 1000);
    setValue('gpsAccuracy', Math.max(0.01, Math.round(gpsFix.accuracy * 100) / 100), { shouldValidate: submitCount > 0 });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [fixAt]);

  const showServerErrors = (error: unknown) => {
    if (!isApiError(error)) return;
    for (const fe of error.fieldErrors) {
      const field = (FIELD_OF_PATH[fe.path] ?? fe.path) as keyof HoleFormValues;
      if (field in defaults) setError(field, { type: 'server', message: fe.message });
    }
  };

  const onSubmit = handleSubmit(async (input) => {
    setNothingChanged(false);
    try {
      if (!base) {
        // A new unidentified line goes in the same request (newLine): the server makes both at once.
        const hole = await create.mutateAsync(input);
        clientId.current = newClientId();
        onSaved(hole, 'created');
        return;
      }
      const body = toUpdateInput(input, base);
      if (!body) {
        setNothingChanged(true);
        return;
      }
      const hole = await update.mutateAsync(body);
      setBase(hole);
      reset(holeToValues(hole, style));
      onSaved(hole, 'updated');
    } catch (error) {
      // No connection: keep a new hole in the outbox (its client id goes with it, so it is sent once).
      // A hole on a new unidentified line is kept whole, newLine and all, and sent as one request.
      if (!base && onKept && isApiError(error) && error.status === 0) {
        // If this browser cannot store it (private mode, storage full), the form keeps the entries as before.
        const kept = await keepHole(project, input).catch(() => null);
        if (kept) {
          clientId.current = newClientId();
          create.reset();
          onKept(kept.clientId);
          return;
        }
      }
      const current = staleHoleOf(error);
      if (current && base) {
        const body = toUpdateInput(input, base);
        if (body) setStale({ current, body });
        return;
      }
      showServerErrors(error);
    }
  });

  /** Rows of the stale comparison: each changed field (the position as one), yours vs saved. */
  function staleRows(current: HoleDto, body: HoleUpdateInput): { rows: StaleRow[]; theirOnly: { key: string; label: string; before: string; after: string }[] } {
    const rows: StaleRow[] = [];
    const mine = body as Record<string, unknown>;
    const positionKeys = POSITION_KEYS as readonly string[];
    const keys = Object.keys(mine).filter((k) => k !== 'version' && !positionKeys.includes(k));
    const fmt = (k: string, v: unknown) => formatHoleField(k, v, fieldCtx);
    const eq = (k: string, a: unknown, b: unknown) => fmt(k, a) === fmt(k, b);
    for (const k of keys) {
      const theirs = (current as unknown as Record<string, unknown>)[k];
      const before = (base as unknown as Record<string, unknown>)[k];
      if (eq(k, mine[k], theirs)) continue;
      rows.push({ key: k, label: HOLE_FIELD_LABELS[k] ?? k, mine: fmt(k, mine[k]), theirs: fmt(k, theirs), bothChanged: !eq(k, before, theirs) });
    }
    if ('positionSource' in mine && base) {
      const m = describePosition(mine as Partial<HoleDto>, fieldCtx);
      const t = describePosition(current, fieldCtx);
      if (m !== t) rows.push({ key: 'position', label: 'Position', mine: m, theirs: t, bothChanged: describePosition(base, fieldCtx) !== t });
    }
    const theirOnly: { key: string; label: string; before: string; after: string }[] = [];
    if (base) {
      for (const k of Object.keys(HOLE_FIELD_LABELS)) {
        if (k === 'position' || k in mine) continue;
        const b = (base as unknown as Record<string, unknown>)[k];
        const c = (current as unknown as Record<string, unknown>)[k];
        if (!eq(k, b, c)) theirOnly.push({ key: k, label: HOLE_FIELD_LABELS[k]!, before: fmt(k, b), after: fmt(k, c) });
      }
      if (!('positionSource' in mine) && describePosition(base, fieldCtx) !== describePosition(current, fieldCtx)) {
        theirOnly.push({ key: 'position', label: 'Position', before: describePosition(base, fieldCtx), after: describePosition(current, fieldCtx) });
      }
    }
    return { rows, theirOnly };
  }

  async function resolveStale(keepMine: string[]) {
    if (!stale) return;
    const { current, body } = stale;
    const next: Record<string, unknown> = { version: current.version };
    const mine = body as Record<string, unknown>;
    for (const k of keepMine) {
      if (k === 'position') for (const p of POSITION_KEYS) if (p in mine) next[p] = mine[p];
      if (k in mine) next[k] = mine[k];
    }
    // Fields the other person did not touch keep the user's value even if not listed (equal values are not rows).
    setStale(null);
    setBase(current);
    if (Object.keys(next).length === 1) {
      reset(holeToValues(current, style));
      onSaved(current, 'unchanged');
      return;
    }
    try {
      const hole = await update.mutateAsync(next as HoleUpdateInput);
      setBase(hole);
      reset(holeToValues(hole, style));
      onSaved(hole, 'updated');
    } catch (error) {
      const again = staleHoleOf(error);
      if (again) setStale({ current: again, body: next as HoleUpdateInput });
      else showServerErrors(error);
    }
  }

  const sortedLines = useMemo(() => [...lines].sort((a, b) => a.label.localeCompare(b.label)), [lines]);
  const unknownLines = sortedLines.filter((l) => l.kind === 'unknown');
  const knownLines = sortedLines.filter((l) => l.kind !== 'unknown');
  const lineOption = (l: LineDto) => (
    <option key={l.id} value={l.id}>
      {l.label} ({LINE_KIND_LABELS[l.kind]}, QL-{l.qualityLevel})
    </option>
  );

  const mutationError = base ? update.error : create.error;
  const offline = isApiError(mutationError) && mutationError.status === 0;
  const errorCount = Object.keys(errors).length;
  const locked = base?.status === 'reviewed';

  if (stale && base) {
    const { rows, theirOnly } = staleRows(stale.current, stale.body);
    return (
      <StaleChoice
        rows={rows}
        theirOnly={theirOnly}
        busy={update.isPending}
        onResolve={(keep) => void resolveStale(keep)}
        onDiscard={() => {
          setStale(null);
          setBase(stale.current);
          reset(holeToValues(stale.current, style));
        }}
      />
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={base ? `Edit test hole ${base.number}` : 'Log a test hole'}>
      <SafetyCautions topics={['one-call', 'tolerance-zone', 'excavation-entry', 'design-aid']} />
      {locked && (
        <Alert tone="caution" title="This hole is reviewed and locked">
          <p>A designer must reopen it, with a reason, before it can change.</p>
        </Alert>
      )}

      <FormSection title="Hole and line">
        <TextField label="Hole number" required autoCapitalize="characters" hint="Holes exposing several lines in one excavation share the number." error={errors.number} {...register('number')} />
        <SelectField label="Line exposed" required error={errors.lineChoice} {...register('lineChoice')}>
          <option value="">Choose the line…</option>
          {canAddLine && <option value={NEW_LINE}>+ New unidentified line (not on any record)</option>}
          {unknownLines.length > 0 && <optgroup label="Unidentified lines">{unknownLines.map(lineOption)}</optgroup>}
          <optgroup label="Lines on record">{knownLines.map(lineOption)}</optgroup>
        </SelectField>
        {lineChoice === NEW_LINE ? (
          <div className="space-y-3 rounded-md bg-ink-50 p-3">
            <TextField label="New line name" required placeholder="e.g. Unidentified 10-in clay pipe" error={errors.newLineLabel} {...register('newLineLabel')} />
            <p className="text-xs text-ink-600">
              Saved with this hole as kind <strong>Unidentified</strong>, owner unknown, status unknown, quality level A at this hole, with the size,
              material and depth below. It is drawn as a {formatLength(2 * convertLength(NEW_LINE_STUB_HALF_METRES, 'm', project.unit), project.unit, 1)} stub
              through the hole along the direction of run, so give that direction. Without signal it is kept on this phone with the hole and both are sent
              together. Treat it as live until identified; the designer extends its path on the Lines tab when more is known.
            </p>
          </div>
        ) : (
          canAddLine && (
            <p className="text-xs text-ink-600">
              Exposed a line that is on no record? If it is one of the <em>Unidentified lines</em> in the list, choose it; otherwise choose <em>+ New
              unidentified line</em> and it is added with this hole.
            </p>
          )
        )}
      </FormSection>

      <FormSection title="Position" description={<>Grid coordinates are in {project.crsCode}, {unit}.</>}>
        <SegmentedChoice
          legend="Position from"
          inputProps={register('positionSource')}
          options={[
            { value: 'grid', label: 'Grid E/N', description: 'Typed easting and northing' },
            ...(bores.length > 0 ? [{ value: 'station' as const, label: 'Station & offset', description: 'On a bore' }] : []),
            { value: 'gps', label: 'Phone GPS', description: 'Approximate; never counted as surveyed' },
          ]}
          error={errors.positionSource}
        />
        {(source === 'map' || source === 'survey') && (
          <p className="text-sm text-ink-700">
            This position came {source === 'map' ? 'from a pick on the map' : 'from the survey'}. Change the values below only if it is wrong; it will then count as a typed grid position.
          </p>
        )}
        {(source === 'grid' || source === 'map' || source === 'survey') && (
          <div className="grid gap-4 sm:grid-cols-2">
            <MeasureField label="Easting" unit={unit} required error={errors.easting} {...register('easting', num)} />
            <MeasureField label="Northing" unit={unit} required error={errors.northing} {...register('northing', num)} />
          </div>
        )}
        {source === 'station' && (
          <div className="space-y-4">
            <SelectField label="Bore" required error={errors.boreId} {...register('boreId')}>
              <option value="">Choose the bore…</option>
              {bores.map((b) => (
                <option key={b.id} value={b.id}>
                  {b.name}
                </option>
              ))}
            </SelectField>
            <div className="grid gap-4 sm:grid-cols-2">
              <TextField
                label="Station"
                required
                inputMode="decimal"
                autoComplete="off"
                spellCheck={false}
                placeholder={style === '100' ? '12+34.56' : '1+234.567'}
                hint={style === '100' ? 'As 12+34.56, or a plain distance such as 1234.56.' : 'As 1+234.567, or a plain distance such as 1234.567.'}
                error={errors.stationText}
                {...register('stationText')}
              />
              <MeasureField label="Offset" unit={unit} required hint="Distance square off the bore line." error={errors.offset} {...register('offset', num)} />
            </div>
            <SegmentedChoice
              legend="Side"
              hint="Looking up-station (towards higher stations)."
              inputProps={register('offsetSide')}
              options={[
                { value: 'L', label: 'Left (L)' },
                { value: 'R', label: 'Right (R)' },
              ]}
              error={errors.offsetSide}
            />
            {stationPreview && <p className={stationPreview.warn ? 'text-sm text-caution-800' : 'text-sm text-ink-600'}>{stationPreview.text}</p>}
          </div>
        )}
        {source === 'gps' && (
          <div className="space-y-3" aria-live="polite">
            <div className="flex flex-wrap items-center gap-2">
              {gps.state.phase === 'seeking' ? (
                <Button variant="secondary" onClick={gps.stop}>
                  Stop and use the best fix
                </Button>
              ) : (
                <Button variant="secondary" onClick={useFix}>
                  {gpsFix ? 'Try again' : 'Use my position'}
                </Button>
              )}
              {gps.state.phase === 'seeking' && (
                <span className="text-sm text-ink-700">
                  Getting a fix…{gpsFix ? ` best so far ±${formatLength(gpsFix.accuracy, project.unit, 1)}` : ''}
                </span>
              )}
            </div>
            {gps.state.phase === 'error' && <Alert tone="danger">{gps.state.message}</Alert>}
            {farFromProject != null && (
              <Alert tone="caution" title="This position is far from the project">
                <p>
                  It is {formatLength(farFromProject, project.unit, 0)} from the nearest line or bore of {project.name}. Check that the phone is at the hole and
                  that this is the right project before saving; or enter the position by grid or station.
                </p>
              </Alert>
            )}
            {gpsFix && (
              <dl className="grid grid-cols-[max-content_1fr] gap-x-3 gap-y-1 text-sm">
                <dt className="text-ink-600">Easting</dt>
                <dd className="tabular">{formatCoordinate(gpsFix.easting, project.unit)}</dd>
                <dt className="text-ink-600">Northing</dt>
                <dd className="tabular">{formatCoordinate(gpsFix.northing, project.unit)}</dd>
                <dt className="text-ink-600">Accuracy</dt>
                <dd className="tabular">
                  ±{formatLength(gpsFix.accuracy, project.unit, 1)} (limit ±{formatLength(project.settings.maxGpsAccuracy, project.unit, 1)})
                </dd>
                <dt className="text-ink-600">Taken</dt>
                <dd>{formatDateTime(gpsFix.at)}</dd>
              </dl>
            )}
            {errors.gpsAccuracy && (
              <p role="alert" className="text-sm text-danger-700">
                {fieldMessage('Phone position', errors.gpsAccuracy.message)}
              </p>
            )}
            <p className="text-xs text-ink-600">
              A phone fix is converted to {project.crsCode} and stored with its accuracy, flagged approximate; it never counts as surveyed. The phone’s
              height is not used: enter the ground elevation below from the survey or the plans.
              {gpsAccuracy != null && ` Stored accuracy: ±${formatLength(gpsAccuracy, project.unit, 2)}.`}
            </p>
          </div>
        )}
      </FormSection>

      <FormSection title="Depth and elevation" description={<>Lengths in {unit}; elevations in {unit}, {datum}.</>}>
        <div className="grid gap-4 sm:grid-cols-2">
          <MeasureField label="Ground elevation" unit={unit} datum={datum} hint="From the survey or the plans, not the phone. Leave empty if unknown." error={errors.groundElevation} {...register('groundElevation', num)} />
          <MeasureField label="Depth below ground" unit={unit} hint="From the ground surface down to the line." error={errors.depthToTop} {...register('depthToTop', num)} />
        </div>
        <SegmentedChoice
          legend="Depth measured to"
          inputProps={register('depthReference')}
          options={[
            { value: 'top', label: 'Top' },
            { value: 'centre', label: 'Centre' },
            { value: 'bottom', label: 'Bottom' },
          ]}
          hint="Which part of the line the tape reached. Top of line elevation is ground − depth only when measured to the top."
          error={errors.depthReference}
        />
        <MeasureField label="Depth to bottom" unit={unit} hint="Where the bottom of the line was seen." error={errors.depthToBottom} {...register('depthToBottom', num)} className="sm:max-w-[calc(50%-0.5rem)]" />
      </FormSection>

      <FormSection title="The line as found">
        <SegmentedChoice
          legend="Shape"
          inputProps={register('sizeShape')}
          options={[
            { value: 'round', label: 'Round pipe or cable' },
            { value: 'box', label: 'Box / duct bank' },
          ]}
        />
        {sizeShape === 'box' ? (
          <div className="grid grid-cols-2 gap-4">
            <MeasureField label="Box width" unit={unit} error={errors.boxWidth} {...register('boxWidth', num)} />
            <MeasureField label="Box height" unit={unit} error={errors.boxHeight} {...register('boxHeight', num)} />
          </div>
        ) : (
          <MeasureField
            label="Measured size"
            unit={unit}
            hint={measuredSize != null && !Number.isNaN(measuredSize) && measuredSize > 0 ? `Outside diameter: ${formatSize(measuredSize, project.unit)}.` : 'Outside diameter, measured on the exposed line.'}
            error={errors.measuredSize}
            {...register('measuredSize', num)}
            className="sm:max-w-[calc(50%-0.5rem)]"
          />
        )}
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Material" placeholder="e.g. PVC C900 (blue)" error={errors.material} {...register('material')} />
          <TextField label="Direction of run" placeholder="e.g. N 83° E" error={errors.direction} {...register('direction')} />
        </div>
        <TextField label="Condition" placeholder="e.g. Coating intact" error={errors.condition} {...register('condition')} />
      </FormSection>

      <FormSection title="Digging record">
        <SegmentedChoice
          legend="Excavation method"
          inputProps={register('method')}
          options={[
            { value: 'air', label: 'Air (vacuum)' },
            { value: 'water', label: 'Water (hydro)' },
          ]}
          error={errors.method}
        />
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="One-call ticket number" inputMode="numeric" autoComplete="off" error={errors.ticketNumber} {...register('ticketNumber')} />
          <TextField label="Surface type" placeholder="e.g. Asphalt, grass" error={errors.surfaceType} {...register('surfaceType')} />
        </div>
        <SegmentedChoice
          legend="Surface marker set"
          inputProps={register('markerSet')}
          options={[
            { value: 'yes', label: 'Yes' },
            { value: 'no', label: 'No' },
          ]}
          error={errors.markerSet}
        />
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Crew" error={errors.crew} {...register('crew')} />
          <TextField label="Dug at" type="datetime-local" error={errors.dugAt} {...register('dugAt')} />
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Soil" placeholder="e.g. Stiff brown clay" error={errors.soil} {...register('soil')} />
          <TextField label="Groundwater" placeholder="e.g. None seen" error={errors.groundwater} {...register('groundwater')} />
        </div>
        <TextField label="Restoration" placeholder="e.g. Backfilled, compacted, topsoil and seed" error={errors.restoration} {...register('restoration')} />
        <TextAreaField label="Notes" error={errors.notes} {...register('notes')} />
      </FormSection>

      {errorCount > 0 && submitCount > 0 && (
        <Alert tone="danger" title={`Not saved: check ${errorCount === 1 ? 'the field' : `the ${errorCount} fields`} marked in red`}>
          <ul className="list-disc pl-5">
            {Object.entries(errors).map(([field, e]) => (
              <li key={field}>{fieldMessage(HOLE_FIELD_LABELS[field] ?? labelOf(field), (e as { message?: string } | undefined)?.message)}</li>
            ))}
          </ul>
        </Alert>
      )}
      {offline ? (
        <Alert tone="danger" title="Not sent: no connection">
          <p>
            Your entries are kept on this screen. Press Save again when the signal returns: the same record id is sent, so the hole can never be made twice.
          </p>
        </Alert>
      ) : (
        mutationError && <ProblemAlert error={mutationError} fields={Object.keys(defaults).concat(['lineId', 'newLine', 'newLine.label', 'station'])} />
      )}
      {nothingChanged && <Alert tone="info">Nothing changed, so nothing was saved.</Alert>}
      <div className="sticky bottom-0 -mx-3 flex flex-wrap gap-2 border-t border-ink-200 bg-ink-50/95 px-3 py-3 sm:static sm:mx-0 sm:border-0 sm:bg-transparent sm:px-0">
        <Button type="submit" className="min-h-12 flex-1 text-base sm:flex-none" busy={isSubmitting} disabled={locked}>
          {base ? 'Save changes' : 'Save test hole'}
        </Button>
        {onCancel && (
          <Button variant="secondary" className="min-h-12" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}

const EXTRA_LABELS: Record<string, string> = {
  lineChoice: 'Line exposed',
  newLineLabel: 'New line name',
  positionSource: 'Position from',
  easting: 'Easting',
  northing: 'Northing',
  boreId: 'Bore',
  stationText: 'Station',
  offset: 'Offset',
  offsetSide: 'Side',
  gpsAccuracy: 'Phone position',
};

function labelOf(field: string): string {
  return EXTRA_LABELS[field] ?? field;
}
