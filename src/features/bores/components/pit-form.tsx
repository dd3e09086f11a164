import { useEffect, useState, type FormEvent } from 'react';
import { PIT_KINDS, type PitKind } from '@shared/domain';
import type { PitDto, ProjectDto } from '@shared/api';
import { pitCreateSchema, pitUpdateSchema } from '@shared/schemas/bore';
import { UNIT_SYMBOLS } from '@shared/units';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { NumberField, SelectField, SelectOptions, TextAreaField } from '@/components/ui/field';
import { FormActions } from '@/components/ui/form';
import { isApiError } from '@/lib/api-client';
import { fieldMessage } from '@/lib/form';
import { useCreatePit } from '../api/create-pit';
import { useUpdatePit } from '../api/update-pit';
import { validate, type PathErrors, pairErrors } from '../utils/validate';
import { numberOf, pointsToRows, rowsToPoints, type VertexRow } from '../utils/bore-form-values';
import { ProjectFrame } from './bore-form';
import { PIT_LABELS } from './bore-list';
import { differingRows, StaleCompare } from './stale-compare';
import { GridVertexEditor } from '@/components/vertex-editor';

const PIT_KIND_LABELS: Record<PitKind, string> = PIT_LABELS;

interface PitFormValues {
  kind: PitKind;
  corners: VertexRow[];
  bottomElevation: string;
  notes: string;
}

function pitValues(pit: PitDto | undefined, kind: PitKind): PitFormValues {
  if (!pit) return { kind, corners: Array.from({ length: 4 }, () => ({ e: '', n: '' })), bottomElevation: '', notes: '' };
  return { kind: pit.kind, corners: pointsToRows(pit.footprint), bottomElevation: String(pit.bottomElevation), notes: pit.notes ?? '' };
}

const SHOWN = /^(kind|footprint(\.\d+(\.[01])?)?|bottomElevation|notes)$/;
const LABELS: Record<string, string> = { kind: 'Kind', footprint: 'Footprint', bottomElevation: 'Bottom elevation', notes: 'Notes', boreId: 'Bore' };

/** The record a 409 stale_version carried, when it looks like a pit. */
function stalePitOf(error: unknown): PitDto | null {
  if (!isApiError(error) || !error.isStale) return null;
  const current = error.problem.current as Partial<PitDto> | undefined;
  return current && typeof current === 'object' && typeof current.version === 'number' && Array.isArray(current.footprint) ? (current as PitDto) : null;
}

/**
 * Add or edit a launch or receiving pit: its kind, footprint corners (grid E/N, at least three;
 * the ring closes itself) and bottom elevation, checked with the shared pit schemas.
 */
export function PitForm({
  project,
  boreId,
  boreName,
  pit,
  defaultKind = 'launch',
  onDone,
  onCancel,
}: {
  project: ProjectDto;
  boreId: number;
  boreName: string;
  pit?: PitDto;
  defaultKind?: PitKind;
  onDone: () => void;
  onCancel: () => void;
}) {
  const unit = UNIT_SYMBOLS[project.unit];
  const create = useCreatePit(project.id);
  const update = useUpdatePit(project.id);
  const mutation = pit ? update : create;
  const [values, setValues] = useState<PitFormValues>(() => pitValues(pit, defaultKind));
  const [errors, setErrors] = useState<PathErrors>({});
  const [theirs, setTheirs] = useState<PitDto | null>(null);
  const [base, setBase] = useState<PitDto | undefined>(pit);
  const set = <K extends keyof PitFormValues>(key: K, value: PitFormValues[K]) => setValues((v) => ({ ...v, [key]: value }));

  const onServerError = (error: unknown) => {
    const current = stalePitOf(error);
    if (current) {
      setTheirs(current);
      return;
    }
    if (isApiError(error)) setErrors(Object.fromEntries(error.fieldErrors.map((e) => [e.path, e.message])));
  };

  const fieldsOf = (v: PitFormValues) => ({
    kind: v.kind,
    footprint: rowsToPoints(v.corners),
    bottomElevation: numberOf(v.bottomElevation),
    notes: v.notes.trim() === '' ? null : v.notes,
  });
  // After the first save attempt, each change re-checks the form, so a fixed field loses its message.
  const [tried, setTried] = useState(false);
  useEffect(() => {
    if (!tried) return;
    const result = pit ? validate(pitUpdateSchema, { ...fieldsOf(values), version: 1 }) : validate(pitCreateSchema, { ...fieldsOf(values), boreId });
    setErrors(result.errors ?? {});
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [values]);

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    setTried(true);
    const fields = fieldsOf(values);
    if (pit) {
      const result = validate(pitUpdateSchema, { ...fields, version: (theirs ?? base ?? pit).version });
      setErrors(result.errors ?? {});
      if (result.data) update.mutate({ pitId: pit.id, input: result.data }, { onSuccess: onDone, onError: onServerError });
    } else {
      const result = validate(pitCreateSchema, { ...fields, boreId });
      setErrors(result.errors ?? {});
      if (result.data) create.mutate(result.data, { onSuccess: onDone, onError: onServerError });
    }
  };

  const title = pit ? `Edit ${PIT_KIND_LABELS[pit.kind].toLowerCase()} of ${boreName}` : `New pit for ${boreName}`;
  const shownServer = isApiError(mutation.error) ? mutation.error.fieldErrors.map((e) => e.path).filter((p) => SHOWN.test(p)) : [];
  const corners = (v: PitFormValues) => v.corners.map((r) => `${r.e}, ${r.n}`).join('; ');

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4 rounded-lg border border-brand-200 bg-white p-4" aria-label={title}>
      <h4 className="text-sm font-semibold text-ink-900">{title}</h4>
      <ProjectFrame project={project} />
      {Object.keys(errors).length > 0 && (
        <Alert tone="danger" title="Check the fields marked below">
          <ul className="list-disc pl-5">
            {Object.entries(errors).map(([path, message]) => (
              <li key={path}>{fieldMessage(LABELS[path.split('.')[0]!] ?? path, message)}</li>
            ))}
          </ul>
        </Alert>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Kind" required error={errors.kind ? { message: errors.kind } : undefined} value={values.kind} onChange={(e) => set('kind', e.target.value as PitKind)}>
          <SelectOptions values={PIT_KINDS} labels={PIT_KIND_LABELS} />
        </SelectField>
        <NumberField
          label="Bottom elevation"
          unit={unit}
          required
          hint={`On ${project.verticalDatum}.`}
          error={errors.bottomElevation ? { message: errors.bottomElevation } : undefined}
          value={values.bottomElevation}
          onChange={(e) => set('bottomElevation', e.target.value)}
        />
      </div>
      <GridVertexEditor
        name="Footprint"
        unit={unit}
        what="Corner"
        plural="corners"
        listName="footprint"
        rows={values.corners}
        onChange={(rows) => set('corners', rows)}
        minRows={3}
        {...pairErrors(errors, 'footprint')}
      />
      <p className="text-xs text-ink-500">Corners in order around the pit; the last joins the first.</p>
      <TextAreaField label="Notes" error={errors.notes ? { message: errors.notes } : undefined} value={values.notes} onChange={(e) => set('notes', e.target.value)} />
      {theirs && pit && (
        <StaleCompare
          what="pit"
          rows={differingRows([
            { label: 'Kind', mine: PIT_KIND_LABELS[values.kind], theirs: PIT_KIND_LABELS[theirs.kind] },
            { label: 'Footprint', mine: corners(values), theirs: corners(pitValues(theirs, theirs.kind)) },
            { label: 'Bottom elevation', mine: values.bottomElevation, theirs: String(theirs.bottomElevation) },
            { label: 'Notes', mine: values.notes, theirs: theirs.notes ?? '' },
          ])}
          onTakeTheirs={() => {
            setValues(pitValues(theirs, theirs.kind));
            setErrors({});
            setBase(theirs);
            setTheirs(null);
            update.reset();
          }}
        />
      )}
      {mutation.error && !theirs && <ProblemAlert error={mutation.error} fields={shownServer} />}
      <FormActions submitLabel={pit ? (theirs ? 'Save mine over theirs' : 'Save pit') : 'Add pit'} busy={mutation.isPending} onCancel={onCancel}>
        {pit && <span className="self-center text-xs text-ink-500">Version {(theirs ?? base ?? pit).version}</span>}
      </FormActions>
    </form>
  );
}
