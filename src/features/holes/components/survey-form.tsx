import { useEffect, useState } from 'react';
import type { HoleDto, ProjectDto } from '@shared/api';
import { holeSurveySchema, type HoleSurveyInput } from '@shared/schemas/hole';
import { UNIT_SYMBOLS } from '@shared/units';
import { Alert, ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { applyServerErrors, asNumberOrNull, useZodForm } from '@/lib/form';
import { staleHoleOf } from '../api/update-hole';
import { useSurveyHole } from '../api/survey-hole';
import { HOLE_FIELD_LABELS, formatHoleField, type FieldContext } from '../utils/hole-fields';
import { MeasureField } from './form-controls';
import { StaleChoice } from './stale-choice';

const FIELDS = ['surveyedEasting', 'surveyedNorthing', 'surveyedTopElevation', 'surveyedGroundElevation'] as const;
type SurveyField = (typeof FIELDS)[number];

function valuesOf(hole: HoleDto): HoleSurveyInput {
  return {
    surveyedEasting: hole.surveyedEasting,
    surveyedNorthing: hole.surveyedNorthing,
    surveyedTopElevation: hole.surveyedTopElevation,
    surveyedGroundElevation: hole.surveyedGroundElevation,
    version: hole.version,
  };
}

/**
 * The surveyor's as-surveyed values, typed on the hole: top-of-line position and elevation, and
 * the ground shot. They win over ground − depth. A stale save shows both values field by field.
 */
export function SurveyForm({ hole, project, ctx, onDone }: { hole: HoleDto; project: ProjectDto; ctx: FieldContext; onDone?: () => void }) {
  const survey = useSurveyHole(project.id, hole.id);
  const [base, setBase] = useState(hole);
  const [stale, setStale] = useState<{ current: HoleDto; mine: HoleSurveyInput } | null>(null);
  const unit = UNIT_SYMBOLS[project.unit];
  const { register, handleSubmit, reset, setError, formState } = useZodForm(holeSurveySchema, { defaultValues: valuesOf(hole) });
  const num = { setValueAs: asNumberOrNull };

  // A newer version arrived (a review, another tie-in): take it unless the surveyor is mid-entry.
  useEffect(() => {
    if (!formState.isDirty && hole.version !== base.version) {
      setBase(hole);
      reset(valuesOf(hole));
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [hole.version]);

  const save = (input: HoleSurveyInput) =>
    survey.mutate(input, {
      onSuccess: (saved) => {
        setBase(saved);
        reset(valuesOf(saved));
        onDone?.();
      },
      onError: (error) => {
        const current = staleHoleOf(error);
        if (current) setStale({ current, mine: input });
        else applyServerErrors(error, setError, FIELDS);
      },
    });

  if (stale) {
    const rows = FIELDS.filter((f) => formatHoleField(f, stale.mine[f], ctx) !== formatHoleField(f, stale.current[f], ctx)).map((f) => ({
      key: f,
      label: HOLE_FIELD_LABELS[f]!,
      mine: formatHoleField(f, stale.mine[f], ctx),
      theirs: formatHoleField(f, stale.current[f], ctx),
      bothChanged: formatHoleField(f, base[f], ctx) !== formatHoleField(f, stale.current[f], ctx),
    }));
    return (
      <StaleChoice
        rows={rows}
        theirOnly={[]}
        busy={survey.isPending}
        onResolve={(keep) => {
          const merged: HoleSurveyInput = { ...valuesOf(stale.current) };
          for (const f of keep as SurveyField[]) merged[f] = stale.mine[f];
          setBase(stale.current);
          setStale(null);
          save(merged);
        }}
        onDiscard={() => {
          setBase(stale.current);
          reset(valuesOf(stale.current));
          setStale(null);
        }}
      />
    );
  }

  return (
    <form onSubmit={handleSubmit((values) => save({ ...values, version: base.version }))} noValidate className="space-y-4" aria-label="Survey values">
      <p className="text-sm text-ink-600">
        As-surveyed shots on the exposed line and the ground beside the hole, in {project.crsCode}, {unit}, elevations {project.verticalDatum}. They win
        over ground − depth wherever the hole is used, and are marked “surveyed”. With the position and top of line entered, a dug hole becomes
        surveyed.
      </p>
      <div className="grid gap-4 sm:grid-cols-2">
        <MeasureField label="Surveyed easting" unit={unit} error={formState.errors.surveyedEasting} {...register('surveyedEasting', num)} />
        <MeasureField label="Surveyed northing" unit={unit} error={formState.errors.surveyedNorthing} {...register('surveyedNorthing', num)} />
        <MeasureField label="Surveyed top of line" unit={unit} datum={project.verticalDatum} hint="Elevation of the top of the line." error={formState.errors.surveyedTopElevation} {...register('surveyedTopElevation', num)} />
        <MeasureField label="Surveyed ground" unit={unit} datum={project.verticalDatum} hint="Ground elevation at the hole." error={formState.errors.surveyedGroundElevation} {...register('surveyedGroundElevation', num)} />
      </div>
      {survey.error && !staleHoleOf(survey.error) && <ProblemAlert error={survey.error} fields={FIELDS} />}
      {survey.isSuccess && !formState.isDirty && <Alert tone="success">Survey values saved.</Alert>}
      <Button type="submit" className="min-h-12" busy={survey.isPending} disabled={!formState.isDirty}>
        Save survey values
      </Button>
    </form>
  );
}
