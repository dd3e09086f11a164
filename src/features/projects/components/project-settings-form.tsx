import { useEffect } from 'react';
import { QUALITY_LEVELS, STATION_STYLES, UNIT_LABELS } from '@shared/domain';
import type { ProjectDto } from '@shared/api';
import { projectUpdateSchema, type ProjectUpdateInput } from '@shared/schemas/project';
import { UNIT_SYMBOLS } from '@shared/units';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { NumberField, SelectField, SelectOptions, TextAreaField, TextField } from '@/components/ui/field';
import { FormActions, FormSection, saveErrorHandler } from '@/components/ui/form';
import { asNumberOrUndefined, asTextOrNull, useZodForm } from '@/lib/form';
import { formatLength } from '@/lib/format';
import { useUpdateProject } from '../api/update-project';
import { crsUnitWarning } from './crs-unit-check';
import { ProjectIdentityFields } from './project-identity-fields';
import { STATION_STYLE_LABELS } from './station-style';

const FIELDS = [
  'name',
  'client',
  'description',
  'crsCode',
  'crsProj4',
  'verticalDatum',
  'stationStyle',
  'settings.verificationDistance',
  'settings.qualityLevelUncertainty.A',
  'settings.qualityLevelUncertainty.B',
  'settings.qualityLevelUncertainty.C',
  'settings.qualityLevelUncertainty.D',
  'settings.extrapolationFactor',
  'settings.maxGpsAccuracy',
] as const;

function valuesOf(project: ProjectDto): ProjectUpdateInput {
  return {
    name: project.name,
    client: project.client,
    description: project.description,
    crsCode: project.crsCode,
    crsProj4: project.crsProj4,
    verticalDatum: project.verticalDatum,
    stationStyle: project.stationStyle,
    settings: project.settings,
    version: project.version,
  };
}

/** Project fields and clearance settings, saved with the version the user loaded. */
export function ProjectSettingsForm({ project }: { project: ProjectDto }) {
  const update = useUpdateProject(project.id);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    watch,
    formState: { errors, isDirty },
  } = useZodForm(projectUpdateSchema, { defaultValues: valuesOf(project) });
  const unit = UNIT_SYMBOLS[project.unit];
  const warning = crsUnitWarning(watch('crsProj4'), project.unit);

  // A newer version arrived (someone else saved, or a 409 brought it): show it unless the user is mid-edit.
  useEffect(() => {
    if (!isDirty) reset(valuesOf(project));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [project.version]);

  const onSubmit = handleSubmit((values) =>
    update.mutate(
      { ...values, version: project.version },
      {
        onSuccess: (saved) => reset(valuesOf(saved)),
        // Someone else saved first: show their version (and carry its version number) before a retry.
        onError: saveErrorHandler(setError, FIELDS, (current: ProjectDto) => reset(valuesOf(current))),
      },
    ),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Project settings">
      <ProjectIdentityFields errors={errors} name={register('name')} client={register('client')} description={register('description', { setValueAs: asTextOrNull })} />

      <FormSection legend="Coordinates and heights">
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="CRS code" required spellCheck={false} hint="EPSG:<number> or CUSTOM." error={errors.crsCode} {...register('crsCode')} />
          <TextField
            label="Linear unit"
            value={UNIT_LABELS[project.unit]}
            readOnly
            disabled
            hint="Fixed for the life of the project: every stored length and elevation is in this unit."
          />
        </div>
        <TextAreaField label="proj4 definition" required spellCheck={false} className="font-mono text-xs" error={errors.crsProj4} {...register('crsProj4')} />
        {warning && <Alert tone="caution">{warning}</Alert>}
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Vertical datum" required hint="Printed beside every elevation." error={errors.verticalDatum} {...register('verticalDatum')} />
          <SelectField label="Station style" required error={errors.stationStyle} {...register('stationStyle')}>
            <SelectOptions values={STATION_STYLES} labels={STATION_STYLE_LABELS} />
          </SelectField>
        </div>
      </FormSection>

      <FormSection legend="Verification and location uncertainty">
        <p className="text-sm text-ink-600">
          Used by the clearance check. A line counts as verified near a crossing when a dug test hole lies within the verification distance. The
          uncertainty by quality level widens the allowance a clearance must leave.
        </p>
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberField label="Verification distance" unit={unit} required error={errors.settings?.verificationDistance} {...register('settings.verificationDistance', { setValueAs: asNumberOrUndefined })} />
          <NumberField
            label="Poorest phone GPS accepted"
            unit={unit}
            required
            hint="Fixes with a worse horizontal accuracy are refused."
            error={errors.settings?.maxGpsAccuracy}
            {...register('settings.maxGpsAccuracy', { setValueAs: asNumberOrUndefined })}
          />
        </div>
        <div className="grid grid-cols-2 gap-4 sm:grid-cols-4">
          {QUALITY_LEVELS.map((level) => (
            <NumberField
              key={level}
              label={`Uncertainty, quality level ${level}`}
              unit={unit}
              required
              error={errors.settings?.qualityLevelUncertainty?.[level]}
              {...register(`settings.qualityLevelUncertainty.${level}`, { setValueAs: asNumberOrUndefined })}
            />
          ))}
        </div>
        <NumberField
          label="Extrapolation allowance"
          unit={`${unit}/${unit}`}
          required
          hint={`Extra uncertainty per unit of distance past the last test hole on a line, 0 to 1 (0.05 adds ${formatLength(0.5, project.unit, 2)} at 10 ${unit}).`}
          error={errors.settings?.extrapolationFactor}
          {...register('settings.extrapolationFactor', { setValueAs: asNumberOrUndefined })}
        />
      </FormSection>

      {/* Outcome beside the buttons: this form is long, and the top is out of view when saving. */}
      {update.error && <ProblemAlert error={update.error} fields={FIELDS} />}
      {update.isSuccess && !isDirty && <Alert tone="success">Project settings saved.</Alert>}
      <FormActions
        submitLabel="Save settings"
        busy={update.isPending}
        submitDisabled={!isDirty}
        cancelLabel="Discard changes"
        cancelDisabled={!isDirty}
        onCancel={() => reset(valuesOf(project))}
        className="items-center"
      >
        <span className="text-xs text-ink-500">Version {project.version}</span>
      </FormActions>
    </form>
  );
}
