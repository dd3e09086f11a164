import { useRef, useState } from 'react';
import { useController } from 'react-hook-form';
import type { z } from 'zod';
import type { LineDto, ProjectDto } from '@shared/api';
import type { GridPoint } from '@shared/schemas/common';
import { LINE_KINDS, LINE_SHAPES, LINE_STATUSES, QUALITY_LEVELS, UNIT_LABELS, type LineShape } from '@shared/domain';
import { lineCreateSchema } from '@shared/schemas/line';
import { UNIT_SYMBOLS } from '@shared/units';
import { KindSwatch } from '@/components/kind-swatch';
import { EN_COLUMNS, VertexEditor } from '@/components/vertex-editor';
import { QUALITY_LEVEL_MEANINGS, QualityLevelBadge } from '@/components/quality-level';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { NumberField, SelectField, SelectOptions, TextAreaField, TextField } from '@/components/ui/field';
import { FormActions, FormSection, saveErrorHandler } from '@/components/ui/form';
import { asNumberOrNull, asNumberOrUndefined, asTextOrNull, fieldMessage, useZodForm } from '@/lib/form';
import { useCreateLine } from '../api/create-line';
import { useUpdateLine } from '../api/update-line';
import { LINE_STATUS_LABELS } from './lines-table';

type Values = z.input<typeof lineCreateSchema>;

/** Every field of the line schemas, for server field errors. */
const FIELDS = [
  'label',
  'owner',
  'contactEmail',
  'kind',
  'shape',
  'diameter',
  'width',
  'height',
  'material',
  'status',
  'qualityLevel',
  'recordDepth',
  'requiredVertical',
  'requiredHorizontal',
  'path',
  'notes',
] as const;

/** Field names as the form shows them (used for the values of a stale save). */
const FIELD_LABELS: Record<(typeof FIELDS)[number], string> = {
  label: 'Label',
  owner: 'Owner',
  contactEmail: 'Contact e-mail',
  kind: 'Kind',
  shape: 'Shape',
  diameter: 'Outside diameter',
  width: 'Box width',
  height: 'Box height',
  material: 'Material',
  status: 'Status',
  qualityLevel: 'Quality level',
  recordDepth: 'Record depth to top',
  requiredVertical: 'Owner’s vertical clearance',
  requiredHorizontal: 'Owner’s horizontal clearance',
  path: 'Plan path',
  notes: 'Notes',
};

const SHAPE_LABELS: Record<LineShape, string> = { round: 'Round (pipe, cable, duct)', box: 'Box (duct bank, culvert)' };

const EMPTY: Values = {
  label: '',
  owner: '',
  contactEmail: '',
  kind: '' as Values['kind'],
  shape: 'round',
  diameter: null,
  width: null,
  height: null,
  material: null,
  status: 'active',
  qualityLevel: 'D',
  recordDepth: undefined as unknown as number,
  requiredVertical: null,
  requiredHorizontal: null,
  path: [],
  notes: null,
};

function valuesOf(line: LineDto): Values {
  return {
    label: line.label,
    owner: line.owner,
    contactEmail: line.contactEmail ?? '',
    kind: line.kind,
    shape: line.shape,
    diameter: line.diameter,
    width: line.width,
    height: line.height,
    material: line.material,
    status: line.status,
    qualityLevel: line.qualityLevel,
    recordDepth: line.recordDepth,
    requiredVertical: line.requiredVertical,
    requiredHorizontal: line.requiredHorizontal,
    path: line.path,
    notes: line.notes,
  };
}

/** Only the size fields of the chosen shape are kept: a box has no diameter, a round line no width or height. */
function forShape<T extends { shape?: LineShape; diameter?: number | null; width?: number | null; height?: number | null }>(values: T): T {
  return values.shape === 'box' ? { ...values, diameter: null } : { ...values, width: null, height: null };
}

function show(value: unknown): string {
  if (value == null || value === '') return '(blank)';
  if (Array.isArray(value)) return value.map((p) => (Array.isArray(p) ? p.join(', ') : String(p))).join(' → ');
  return String(value);
}

/**
 * Add a line, or edit one (PATCH with its version). A stale save (someone else saved first)
 * refills the form with the line as it now stands and lists, field by field, the value this
 * person tried to save beside the one now saved.
 */
export function LineForm({ project, line, onDone, onCancel }: { project: ProjectDto; line?: LineDto; onDone: (saved: LineDto) => void; onCancel: () => void }) {
  const create = useCreateLine(project.id);
  const update = useUpdateLine(project.id, line?.id ?? 0);
  const mutation = line ? update : create;
  const version = useRef(line?.version ?? 0);
  const [pathKey, setPathKey] = useState(0);
  const [stale, setStale] = useState<{ field: string; mine: string; theirs: string }[] | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    watch,
    control,
    formState: { errors, isDirty },
  } = useZodForm(lineCreateSchema, { defaultValues: line ? valuesOf(line) : EMPTY });
  const path = useController({ control, name: 'path' });
  const unit = UNIT_SYMBOLS[project.unit];
  const shape = watch('shape');
  const kind = watch('kind');
  const ql = watch('qualityLevel');

  const onSubmit = handleSubmit((raw) => {
    const values = forShape(raw);
    setStale(null);
    if (!line) {
      create.mutate(values, { onSuccess: onDone, onError: saveErrorHandler(setError, FIELDS) });
      return;
    }
    update.mutate(
      { ...values, version: version.current },
      {
        onSuccess: onDone,
        onError: saveErrorHandler(setError, FIELDS, (current: LineDto) => {
          const now = valuesOf(current);
          const diffs = FIELDS.filter((f) => show(values[f]) !== show(now[f])).map((f) => ({ field: FIELD_LABELS[f], mine: show(values[f]), theirs: show(now[f]) }));
          setStale(diffs);
          version.current = current.version;
          reset(now);
          setPathKey((k) => k + 1); // the vertex rows are read again from the refilled form
        }),
      },
    );
  });

  const formName = line ? `Edit line ${line.label}` : 'Add a line';
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={formName}>
      {mutation.error && <ProblemAlert error={mutation.error} fields={FIELDS} />}
      {stale && (
        <Alert tone="caution" title="Your values and the ones now saved">
          {stale.length === 0 ? (
            <p>The other save set the same values as yours.</p>
          ) : (
            <ul className="space-y-1" aria-label="Values changed by the other save">
              {stale.map((d) => (
                <li key={d.field}>
                  <span className="font-medium">{d.field}</span>: yours <span className="break-all">{d.mine}</span>; now saved <span className="break-all">{d.theirs}</span>
                </li>
              ))}
            </ul>
          )}
          <p>The form shows the saved values. Make your change again and save.</p>
        </Alert>
      )}

      <FormSection legend="Line">
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Label" required hint="How people name it: “8-in water main, north side”." error={errors.label} {...register('label')} />
          <TextField label="Owner" required hint="The utility owner or operator." error={errors.owner} {...register('owner')} />
          <TextField label="Contact e-mail" type="email" hint="The owner’s contact for conflict mail (optional)." error={errors.contactEmail} {...register('contactEmail')} />
          <SelectField label="Status" required error={errors.status} {...register('status')}>
            <SelectOptions values={LINE_STATUSES} labels={LINE_STATUS_LABELS} />
          </SelectField>
        </div>
        <fieldset aria-describedby={errors.kind ? 'line-kind-error' : undefined}>
          <legend className="text-sm font-medium text-ink-800">
            Kind<span className="text-danger-600" aria-hidden title="Required"> *</span>
          </legend>
          <p className="text-xs text-ink-500">In its APWA marking colour. Unidentified: a line on no record, treated as live.</p>
          <div className="mt-2 grid grid-cols-1 gap-1 min-[440px]:grid-cols-2 lg:grid-cols-5">
            {LINE_KINDS.map((k) => (
              <label key={k} className="flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-ink-200 px-3 text-sm has-[:checked]:border-brand-600 has-[:checked]:bg-brand-50">
                <input type="radio" value={k} className="size-4 accent-brand-700" {...register('kind')} />
                <KindSwatch kind={k} />
              </label>
            ))}
          </div>
          {errors.kind && (
            <p id="line-kind-error" className="mt-1 text-sm text-danger-700">
              {fieldMessage('Kind', errors.kind.message)}
            </p>
          )}
          {kind === 'unknown' && <p className="mt-1 text-xs text-caution-800">Treat an unidentified line as live until it is identified.</p>}
        </fieldset>
      </FormSection>

      <FormSection legend={`Size and material (${UNIT_LABELS[project.unit]})`}>
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField label="Shape" required error={errors.shape} {...register('shape')}>
            <SelectOptions values={LINE_SHAPES} labels={SHAPE_LABELS} />
          </SelectField>
          {shape === 'box' ? (
            <div className="grid grid-cols-2 gap-4">
              <NumberField label="Box width" unit={unit} required error={errors.width} {...register('width', { setValueAs: asNumberOrNull })} />
              <NumberField label="Box height" unit={unit} required error={errors.height} {...register('height', { setValueAs: asNumberOrNull })} />
            </div>
          ) : (
            <NumberField label="Outside diameter" unit={unit} required hint={`Outside, in ${unit}`} error={errors.diameter} {...register('diameter', { setValueAs: asNumberOrNull })} />
          )}
          <TextField label="Material" hint="PVC C900, ductile iron, steel, HDPE…" error={errors.material} {...register('material', { setValueAs: asTextOrNull })} />
        </div>
      </FormSection>

      <FormSection legend="Depth and reliability">
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberField
            label="Record depth to top"
            unit={unit}
            required
            hint={`Below ground, in ${unit}; stands in where no test hole has exposed the line (elevations in ${project.verticalDatum}).`}
            error={errors.recordDepth}
            {...register('recordDepth', { setValueAs: asNumberOrUndefined })}
          />
          <fieldset>
            <legend className="text-sm font-medium text-ink-800">
              Quality level<span className="text-danger-600" aria-hidden title="Required"> *</span>
            </legend>
            <div className="mt-1 flex flex-wrap gap-1">
              {QUALITY_LEVELS.map((q) => (
                <label key={q} className="flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-ink-200 px-3 text-sm has-[:checked]:border-brand-600 has-[:checked]:bg-brand-50">
                  <input type="radio" value={q} className="size-4 accent-brand-700" aria-label={QUALITY_LEVEL_MEANINGS[q]} {...register('qualityLevel')} />
                  <QualityLevelBadge level={q} />
                </label>
              ))}
            </div>
            <p className="mt-1 text-xs text-ink-600">{ql ? QUALITY_LEVEL_MEANINGS[ql] : null} (ASCE/UESI/CI 38-22).</p>
            {errors.qualityLevel && <p className="text-sm text-danger-700">{fieldMessage('Quality level', errors.qualityLevel.message)}</p>}
          </fieldset>
          <NumberField
            label="Owner’s vertical clearance"
            unit={unit}
            hint="Only if the owner requires more than the project rule for the kind; blank uses the rule."
            error={errors.requiredVertical}
            {...register('requiredVertical', { setValueAs: asNumberOrNull })}
          />
          <NumberField
            label="Owner’s horizontal clearance"
            unit={unit}
            hint="Blank uses the project rule."
            error={errors.requiredHorizontal}
            {...register('requiredHorizontal', { setValueAs: asNumberOrNull })}
          />
        </div>
      </FormSection>

      <FormSection legend={`Plan path (${project.crsCode}, ${unit})`}>
        <PlanPath
          key={pathKey}
          value={path.field.value}
          onChange={path.field.onChange}
          onBlur={path.field.onBlur}
          errors={errors.path as PathErrors}
          unitSymbol={unit}
          crsCode={project.crsCode}
        />
      </FormSection>

      <TextAreaField label="Notes" hint="Records it comes from (as-built sheet), what is known of it." error={errors.notes} {...register('notes', { setValueAs: asTextOrNull })} />

      <FormActions
        submitLabel={line ? 'Save line' : 'Add line'}
        busy={mutation.isPending}
        submitDisabled={line ? !isDirty : false}
        onCancel={onCancel}
      />
    </form>
  );
}

type Row = { e: string; n: string };
type Msg = { message?: string } | undefined;
/** What react-hook-form reports for `path`: a message for the whole list, or per vertex and coordinate. */
type PathErrors = (Msg & { [index: number]: (Msg & { 0?: Msg; 1?: Msg }) | undefined }) | undefined;

const toText = (v: number | null | undefined) => (v == null || Number.isNaN(v) ? '' : String(v));
/** A vertex as the schema reads it: blank → null ("is required"), bad text → NaN ("must be a number"). */
const pointOf = (r: Row) => [asNumberOrNull(r.e), asNumberOrNull(r.n)] as unknown as GridPoint;

/**
 * The plan path as grid E/N vertices in the project's unit, in the shared vertex editor (rows to
 * type into, a paste box that replaces the path or extends it at its end). The rows keep the text
 * typed; every change hands the whole path to the form, whose schema checks it.
 */
function PlanPath({
  value,
  onChange,
  onBlur,
  errors,
  unitSymbol,
  crsCode,
}: {
  value: readonly (readonly (number | null)[])[] | undefined;
  onChange: (path: GridPoint[]) => void;
  onBlur: () => void;
  errors: PathErrors;
  unitSymbol: string;
  crsCode: string;
}) {
  const [rows, setRows] = useState<Row[]>(() => {
    const initial = (value ?? []).map((p) => ({ e: toText(p[0]), n: toText(p[1]) }));
    while (initial.length < 2) initial.push({ e: '', n: '' });
    return initial;
  });
  return (
    <VertexEditor
      legend={
        <>
          Plan path<span className="text-danger-600" aria-hidden title="Required"> *</span>
        </>
      }
      description={`Grid easting and northing of each vertex in ${crsCode}, in ${unitSymbol}, in order along the line (at least two).`}
      what="Vertex"
      plural="vertices"
      listName="path"
      listLabel="Plan path"
      columns={EN_COLUMNS}
      rows={rows}
      onChange={(next) => {
        setRows(next);
        onChange(next.map(pointOf));
      }}
      onBlur={onBlur}
      minRows={2}
      cellError={(i, c) => errors?.[i]?.[c]?.message}
      rowError={(i) => errors?.[i]?.message}
      listError={errors?.message}
    />
  );
}
