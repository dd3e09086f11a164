import { useEffect, useState } from 'react';
import { LINEAR_UNITS, STATION_STYLES, UNIT_LABELS } from '@shared/domain';
import type { ProjectDto } from '@shared/api';
import { projectCreateSchema } from '@shared/schemas/project';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { SelectField, SelectOptions, TextAreaField, TextField } from '@/components/ui/field';
import { FormActions, FormSection, saveErrorHandler } from '@/components/ui/form';
import { asTextOrNull, useZodForm } from '@/lib/form';
import { useCreateProject } from '../api/create-project';
import { crsUnitWarning } from './crs-unit-check';
import { ProjectIdentityFields } from './project-identity-fields';
import { STATION_STYLE_LABELS } from './station-style';

const FIELDS = ['name', 'client', 'description', 'crsCode', 'crsProj4', 'unit', 'verticalDatum', 'stationStyle'] as const;

/** The "New project" form: identity, horizontal CRS, unit, vertical datum and station style. */
export function ProjectCreateForm({ onCreated, onCancel }: { onCreated: (project: ProjectDto) => void; onCancel: () => void }) {
  const create = useCreateProject();
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    getFieldState,
    watch,
    formState: { errors },
  } = useZodForm(projectCreateSchema, {
    defaultValues: { name: '', client: '', description: null, crsCode: 'EPSG:', crsProj4: '', unit: 'usft', verticalDatum: '', stationStyle: '100' },
  });
  const warning = crsUnitWarning(watch('crsProj4'), watch('unit'));

  // A code in the built-in catalogue fills in its definition and unit (loaded on demand: the
  // catalogue brings proj4 with it), and the usual station style for that unit.
  const code = watch('crsCode');
  const [found, setFound] = useState<string | null>(null);
  useEffect(() => {
    let current = true;
    setFound(null);
    if (!/^EPSG:\d{4,6}$/i.test(code.trim())) return;
    void import('@shared/geometry/crs').then(({ findCrs }) => {
      const crs = findCrs(code);
      if (!current || !crs) return;
      setValue('crsProj4', crs.proj4, { shouldValidate: true });
      setValue('unit', crs.unit, { shouldValidate: true });
      if (!getFieldState('stationStyle').isDirty) setValue('stationStyle', crs.unit === 'm' ? '1000' : '100');
      setFound(`${crs.code} ${crs.name}: definition and unit filled in from the built-in catalogue.`);
    });
    return () => {
      current = false;
    };
  }, [code, setValue, getFieldState]);

  const onSubmit = handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: onCreated,
      onError: saveErrorHandler(setError, FIELDS),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="New project">
      {create.error && <ProblemAlert error={create.error} fields={FIELDS} />}
      <ProjectIdentityFields errors={errors} name={register('name')} client={register('client')} description={register('description', { setValueAs: asTextOrNull })} />

      <FormSection legend="Coordinates and heights">
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField
            label="CRS code"
            required
            autoCapitalize="characters"
            spellCheck={false}
            hint="EPSG:<number> of the projected grid your survey uses (known codes fill in the rest), or CUSTOM."
            error={errors.crsCode}
            {...register('crsCode')}
          />
          <SelectField label="Linear unit" required hint="Fixed once the project is created: every stored number is in it." error={errors.unit} {...register('unit')}>
            <SelectOptions values={LINEAR_UNITS} labels={UNIT_LABELS} />
          </SelectField>
        </div>
        <TextAreaField
          label="proj4 definition"
          required
          spellCheck={false}
          className="font-mono text-xs"
          placeholder="+proj=lcc +lat_1=… +lat_2=… +lat_0=… +lon_0=… +x_0=… +y_0=… +ellps=GRS80 +units=us-ft +no_defs"
          hint="Copy it from your survey control or the EPSG registry. Used only to place the grid on the map and to convert phone GPS."
          error={errors.crsProj4}
          {...register('crsProj4')}
        />
        {found && <p className="text-sm text-ok-700" role="status">{found}</p>}
        {warning && <Alert tone="caution">{warning}</Alert>}
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Vertical datum" required placeholder="NAVD 88" hint="Printed beside every elevation." error={errors.verticalDatum} {...register('verticalDatum')} />
          <SelectField label="Station style" required hint="100-unit stations are usual on foot projects, 1000-unit on metre projects." error={errors.stationStyle} {...register('stationStyle')}>
            <SelectOptions values={STATION_STYLES} labels={STATION_STYLE_LABELS} />
          </SelectField>
        </div>
      </FormSection>

      <FormActions submitLabel="Create project" busy={create.isPending} onCancel={onCancel} />
    </form>
  );
}
