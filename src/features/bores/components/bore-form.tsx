import { useEffect, useId, useState, type FormEvent } from 'react';
import { BORE_METHOD_LABELS, BORE_METHODS, UNIT_LABELS } from '@shared/domain';
import type { BoreDto, ProjectDto } from '@shared/api';
import { formatStation, parseStation } from '@shared/geometry';
import type { StationStyle } from '@shared/domain';
import { UNIT_SYMBOLS } from '@shared/units';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { NumberField, SelectField, SelectOptions, TextAreaField, TextField } from '@/components/ui/field';
import { FormActions, FormSection } from '@/components/ui/form';
import { isApiError } from '@/lib/api-client';
import { fieldMessage } from '@/lib/form';
import { formatLength, polylineLength } from '@/lib/format';
import { useCreateBore } from '../api/create-bore';
import { staleBoreOf, useUpdateBore } from '../api/update-bore';
import {
  boreValues,
  displayPath,
  emptyBoreValues,
  profileCoverageWarning,
  rowsToPoints,
  SHOWN_PATH,
  toBoreCreate,
  toBoreUpdate,
  type BoreFormValues,
} from '../utils/bore-form-values';
import { pairErrors, type PathErrors } from '../utils/validate';
import { differingRows, StaleCompare } from './stale-compare';
import { GridVertexEditor, VertexEditor, type PairColumn, type VertexEditorProps } from '@/components/vertex-editor';

/** Field names for the summary at the top of the form, by the first part of a problem's path. */
const LABELS: Record<string, string> = {
  name: 'Name',
  method: 'Method',
  beginStation: 'Begin station',
  alignment: 'Alignment',
  casingOd: 'Casing outside diameter',
  carrierSize: 'Carrier pipe size',
  toleranceHorizontal: 'Tolerance, line',
  toleranceVertical: 'Tolerance, grade',
  minCover: 'Minimum cover',
  entryElevation: 'Entry elevation',
  exitElevation: 'Exit elevation',
  profile: 'Profile',
  groundProfile: 'Ground profile',
  notes: 'Notes',
};

/** The fields the edit form sends, as text, for the side-by-side view after a 409. */
function compareFields(mine: BoreFormValues, theirs: BoreFormValues) {
  const vertices = (v: BoreFormValues) => v.vertices.map((r) => `${r.e}, ${r.n}`).join('; ');
  const ground = (v: BoreFormValues) => v.groundPoints.map((r) => `${r.station} ${r.elevation}`).join('; ');
  return [
    { label: 'Name', mine: mine.name, theirs: theirs.name },
    { label: 'Method', mine: BORE_METHOD_LABELS[mine.method], theirs: BORE_METHOD_LABELS[theirs.method] },
    { label: 'Begin station', mine: mine.beginStation, theirs: theirs.beginStation },
    { label: 'Alignment', mine: vertices(mine), theirs: vertices(theirs) },
    { label: 'Casing outside diameter', mine: mine.casingOd, theirs: theirs.casingOd },
    { label: 'Carrier pipe size', mine: mine.carrierSize, theirs: theirs.carrierSize },
    { label: 'Tolerance, line', mine: mine.toleranceHorizontal, theirs: theirs.toleranceHorizontal },
    { label: 'Tolerance, grade', mine: mine.toleranceVertical, theirs: theirs.toleranceVertical },
    { label: 'Minimum cover', mine: mine.minCover, theirs: theirs.minCover },
    { label: 'Ground profile', mine: ground(mine), theirs: ground(theirs) },
    { label: 'Notes', mine: mine.notes, theirs: theirs.notes },
  ];
}

type ProfileRow = BoreFormValues['profilePoints'][number];

/**
 * Station–elevation rows of a profile (casing or ground) in the shared vertex editor: stations
 * typed in the project's style and read by the shared station parser, also when pasted.
 */
function ProfileRows({
  project,
  path,
  errors,
  ...props
}: Omit<VertexEditorProps<keyof ProfileRow>, 'columns' | 'parse' | 'cellError' | 'rowError' | 'listError'> & { project: ProjectDto; path: string; errors: PathErrors }) {
  const unit = UNIT_SYMBOLS[project.unit];
  const columns: readonly [PairColumn<keyof ProfileRow>, PairColumn<keyof ProfileRow>] = [
    { key: 'station', name: 'station', placeholder: 'Station', inputMode: 'text' },
    { key: 'elevation', name: 'elevation', labelSuffix: `(${unit}, ${project.verticalDatum})`, placeholder: `Elevation ${unit}` },
  ];
  return <VertexEditor {...props} columns={columns} parse={{ parseFirst: (text) => parseStation(text, project.stationStyle) }} {...pairErrors(errors, path, ['station', 'elevation'])} />;
}

function stationOrNull(text: string, style: StationStyle): number | null {
  try {
    return parseStation(text, style);
  } catch {
    return null;
  }
}

const err = (errors: PathErrors, path: string) => (errors[path] ? { message: errors[path] } : undefined);

/** The project's grid, unit and datum, shown beside the coordinates and heights. */
export function ProjectFrame({ project }: { project: ProjectDto }) {
  return (
    <p className="text-xs text-ink-600" data-testid="bore-form-frame">
      Grid coordinates in {project.crsCode}, {UNIT_LABELS[project.unit]} ({UNIT_SYMBOLS[project.unit]}); elevations on {project.verticalDatum}; stations
      like {formatStation(1234.5, project.stationStyle)}.
    </p>
  );
}

/**
 * Add a bore (name, method, begin station, alignment, casing, tolerances, a first casing profile
 * and the ground profile), or edit an existing bore's fields except its casing profile (that is
 * edited with live clearances in Plan & profile). Checked with the shared schemas before it is
 * sent; the server's problems land on the same fields.
 */
export function BoreForm({ project, bore, onDone, onCancel }: { project: ProjectDto; bore?: BoreDto; onDone: (saved: BoreDto) => void; onCancel: () => void }) {
  const style = project.stationStyle;
  const unit = UNIT_SYMBOLS[project.unit];
  const formId = useId();
  const create = useCreateBore(project.id);
  const update = useUpdateBore(project.id);
  const [values, setValues] = useState<BoreFormValues>(() => (bore ? boreValues(bore, style) : emptyBoreValues(style)));
  const [errors, setErrors] = useState<PathErrors>({});
  /** After a 409: the bore as someone else saved it; saving again uses its version. */
  const [theirs, setTheirs] = useState<BoreDto | null>(null);
  /** The saved bore the form's values started from (the one it was opened on, or the saved one taken after a 409). */
  const [base, setBase] = useState<BoreDto | undefined>(bore);
  const mutation = bore ? update : create;

  const set = <K extends keyof BoreFormValues>(key: K, value: BoreFormValues[K]) => setValues((v) => ({ ...v, [key]: value }));
  const shown = (errs: PathErrors): PathErrors => Object.fromEntries(Object.entries(errs).map(([p, m]) => [displayPath(p, values.profileMode), m]));

  const onServerError = (error: unknown) => {
    const current = staleBoreOf(error);
    if (current) {
      setTheirs(current);
      return;
    }
    if (isApiError(error)) setErrors(shown(Object.fromEntries(error.fieldErrors.map((e) => [e.path, e.message]))));
  };

  const check = (v: BoreFormValues) => (bore ? toBoreUpdate(v, style, (theirs ?? base ?? bore).version) : toBoreCreate(v, style));
  // After the first save attempt, each change re-checks the form, so a fixed field loses its message.
  const [tried, setTried] = useState(false);
  useEffect(() => {
    if (!tried) return;
    const result = check(values);
    setErrors(result.errors ? shown(result.errors) : {});
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [values]);

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    setTried(true);
    if (bore) {
      const result = toBoreUpdate(values, style, (theirs ?? base ?? bore).version);
      setErrors(result.errors ? shown(result.errors) : {});
      if (!result.input) return;
      update.mutate({ boreId: bore.id, input: result.input }, { onSuccess: (saved) => onDone(saved), onError: onServerError });
    } else {
      const result = toBoreCreate(values, style);
      setErrors(result.errors ? shown(result.errors) : {});
      if (!result.input) return;
      create.mutate(result.input, { onSuccess: (saved) => onDone(saved), onError: onServerError });
    }
  };

  const fieldErrorCount = Object.keys(errors).length;
  const serverFieldsShown = isApiError(mutation.error) ? mutation.error.fieldErrors.map((e) => e.path).filter((p) => SHOWN_PATH.test(displayPath(p, values.profileMode))) : [];
  const alignment = rowsToPoints(values.vertices);
  const planLength = alignment.every(([e, n]) => Number.isFinite(e) && Number.isFinite(n)) ? polylineLength(alignment as [number, number][]) : null;
  const coverage = bore ? profileCoverageWarning(values, bore, style) : null;
  // Named as opened: a newer name someone saved meanwhile shows in the card and the comparison.
  const [title] = useState(() => (bore ? `Edit ${bore.name}` : 'New bore'));

  return (
    <form id={formId} onSubmit={onSubmit} noValidate className="space-y-4 rounded-lg border border-brand-200 bg-white p-4" aria-label={title}>
      <h3 className="text-base font-semibold text-ink-900">{title}</h3>
      <ProjectFrame project={project} />
      {fieldErrorCount > 0 && (
        <Alert tone="danger" title="Check the fields marked below">
          <ul className="list-disc pl-5">
            {Object.entries(errors)
              .slice(0, 6)
              .map(([path, message]) => (
                <li key={path}>{fieldMessage(LABELS[path.split('.')[0]!] ?? path, message)}</li>
              ))}
          </ul>
        </Alert>
      )}

      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Name" required error={err(errors, 'name')} value={values.name} maxLength={120} onChange={(e) => set('name', e.target.value)} />
        <SelectField label="Method" required error={err(errors, 'method')} value={values.method} onChange={(e) => set('method', e.target.value as BoreFormValues['method'])}>
          <SelectOptions values={BORE_METHODS} labels={BORE_METHOD_LABELS} />
        </SelectField>
      </div>

      <FormSection legend="Plan alignment">
        <TextField
          label="Begin station"
          required
          spellCheck={false}
          autoComplete="off"
          hint={`Station of the first vertex, e.g. ${formatStation(0, style)} or a plain distance.`}
          error={err(errors, 'beginStation')}
          value={values.beginStation}
          onChange={(e) => set('beginStation', e.target.value)}
        />
        <GridVertexEditor
          name="Alignment"
          unit={unit}
          what="Vertex"
          plural="vertices"
          listName="alignment"
          rows={values.vertices}
          onChange={(rows) => set('vertices', rows)}
          minRows={2}
          {...pairErrors(errors, 'alignment')}
        />
        {planLength != null && planLength > 0 && (
          <p className="text-sm text-ink-700" data-testid="bore-form-length">
            Plan length {formatLength(planLength, project.unit)}; stations{' '}
            {(() => {
              const begin = stationOrNull(values.beginStation, style);
              return begin != null ? `${formatStation(begin, style)} to ${formatStation(begin + planLength, style)}` : 'from the begin station';
            })()}
            .
          </p>
        )}
        {coverage && <Alert tone="caution">{coverage}</Alert>}
      </FormSection>

      <FormSection legend="Casing and tolerances">
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberField label="Casing outside diameter" unit={unit} required error={err(errors, 'casingOd')} value={values.casingOd} onChange={(e) => set('casingOd', e.target.value)} />
          <NumberField label="Carrier pipe size" unit={unit} hint="Optional." error={err(errors, 'carrierSize')} value={values.carrierSize} onChange={(e) => set('carrierSize', e.target.value)} />
          <NumberField
            label="Tolerance, line"
            unit={unit}
            required
            hint="How far the bore may wander sideways from the alignment."
            error={err(errors, 'toleranceHorizontal')}
            value={values.toleranceHorizontal}
            onChange={(e) => set('toleranceHorizontal', e.target.value)}
          />
          <NumberField
            label="Tolerance, grade"
            unit={unit}
            required
            hint="How far it may wander above or below the profile."
            error={err(errors, 'toleranceVertical')}
            value={values.toleranceVertical}
            onChange={(e) => set('toleranceVertical', e.target.value)}
          />
          <NumberField label="Minimum cover" unit={unit} required error={err(errors, 'minCover')} value={values.minCover} onChange={(e) => set('minCover', e.target.value)} />
        </div>
      </FormSection>

      {!bore && (
        <FormSection legend={`Casing centreline profile (${unit}, ${project.verticalDatum})`}>
          <div className="flex flex-wrap gap-4 text-sm" role="radiogroup" aria-label="Profile entry">
            <label className="flex min-h-11 items-center gap-2">
              <input type="radio" name={`${formId}-mode`} className="size-5 accent-brand-700" checked={values.profileMode === 'straight'} onChange={() => set('profileMode', 'straight')} />
              Straight grade, entry to exit
            </label>
            <label className="flex min-h-11 items-center gap-2">
              <input type="radio" name={`${formId}-mode`} className="size-5 accent-brand-700" checked={values.profileMode === 'points'} onChange={() => set('profileMode', 'points')} />
              Profile points
            </label>
          </div>
          {values.profileMode === 'straight' ? (
            <div className="grid gap-4 sm:grid-cols-2">
              <NumberField
                label="Entry elevation"
                unit={unit}
                required
                hint={`Casing centreline at the begin station, on ${project.verticalDatum}.`}
                error={err(errors, 'entryElevation')}
                value={values.entryElevation}
                onChange={(e) => set('entryElevation', e.target.value)}
              />
              <NumberField
                label="Exit elevation"
                unit={unit}
                required
                hint={`At the end station, on ${project.verticalDatum}.`}
                error={err(errors, 'exitElevation')}
                value={values.exitElevation}
                onChange={(e) => set('exitElevation', e.target.value)}
              />
            </div>
          ) : (
            <ProfileRows
              project={project}
              path="profile"
              errors={errors}
              legend="Profile points"
              description={`Station (like ${formatStation(0, style)}) and casing centreline elevation, in increasing station order.`}
              what="Profile point"
              plural="profile points"
              listName="profile"
              rows={values.profilePoints}
              onChange={(rows) => set('profilePoints', rows)}
              minRows={2}
            />
          )}
          <p className="text-xs text-ink-500">Shape the profile afterwards with every clearance recomputed as you drag, in Plan &amp; profile.</p>
        </FormSection>
      )}

      <FormSection legend={`Ground profile (${unit}, ${project.verticalDatum})`}>
        <ProfileRows
          project={project}
          path="groundProfile"
          errors={errors}
          legend="Ground surface over the bore"
          description={`Station (like ${formatStation(0, style)}) and ground elevation in ${unit} on ${project.verticalDatum}, in increasing station order: none, or two or more points. With it, Plan & profile shows the ground line and checks the minimum cover.`}
          what="Ground point"
          plural="ground points"
          listName="ground profile"
          rows={values.groundPoints}
          onChange={(rows) => set('groundPoints', rows)}
          minRows={0}
        />
      </FormSection>

      <TextAreaField label="Notes" error={err(errors, 'notes')} value={values.notes} onChange={(e) => set('notes', e.target.value)} />

      {theirs && bore && (
        <StaleCompare
          what="bore"
          rows={differingRows(compareFields(values, boreValues(theirs, style)))}
          onTakeTheirs={() => {
            setValues(boreValues(theirs, style));
            setErrors({});
            setBase(theirs);
            setTheirs(null);
            update.reset();
          }}
        />
      )}
      {mutation.error && !theirs && <ProblemAlert error={mutation.error} fields={serverFieldsShown} />}
      <FormActions submitLabel={bore ? (theirs ? 'Save mine over theirs' : 'Save bore') : 'Add bore'} busy={mutation.isPending} onCancel={onCancel}>
        {bore && <span className="self-center text-xs text-ink-500">Version {(theirs ?? base ?? bore).version}</span>}
      </FormActions>
    </form>
  );
}
