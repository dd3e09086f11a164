import { LINE_KIND_LABELS, type LineKind, type LinearUnit } from '@shared/domain';
import type { ClearanceRuleDto } from '@shared/api';
import { clearanceRuleSchema, clearanceRuleUpdateSchema } from '@shared/schemas/project';
import { UNIT_SYMBOLS } from '@shared/units';
import { ProblemAlert } from '@/components/ui/alert';
import { NumberField, SelectField, SelectOptions, TextField } from '@/components/ui/field';
import { FormActions, saveErrorHandler } from '@/components/ui/form';
import { asNumberOrUndefined, asTextOrNull, useZodForm } from '@/lib/form';
import { useCreateRule } from '../api/create-rule';
import { useUpdateRule } from '../api/update-rule';

const CREATE_FIELDS = ['kind', 'vertical', 'horizontal', 'source'] as const;
const UPDATE_FIELDS = ['vertical', 'horizontal', 'source'] as const;
const SOURCE_HINT = 'Where the value comes from: the owner’s letter, a standard, the local authority.';

/** Add a rule for a line kind that has none yet. */
export function RuleCreateForm({ projectId, unit, kinds, onDone }: { projectId: number; unit: LinearUnit; kinds: LineKind[]; onDone: () => void }) {
  const create = useCreateRule(projectId);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useZodForm(clearanceRuleSchema, { defaultValues: { kind: kinds[0], source: null } });

  const onSubmit = handleSubmit((values) =>
    create.mutate(values, {
      onSuccess: onDone,
      onError: saveErrorHandler(setError, CREATE_FIELDS),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Add clearance rule">
      {create.error && <ProblemAlert error={create.error} fields={CREATE_FIELDS} />}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <SelectField label="Line kind" required error={errors.kind} {...register('kind')}>
          <SelectOptions values={kinds} labels={LINE_KIND_LABELS} />
        </SelectField>
        <NumberField label="Vertical clearance" unit={UNIT_SYMBOLS[unit]} required error={errors.vertical} {...register('vertical', { setValueAs: asNumberOrUndefined })} />
        <NumberField label="Horizontal clearance" unit={UNIT_SYMBOLS[unit]} required error={errors.horizontal} {...register('horizontal', { setValueAs: asNumberOrUndefined })} />
        <TextField label="Source" hint={SOURCE_HINT} error={errors.source} {...register('source', { setValueAs: asTextOrNull })} />
      </div>
      <FormActions submitLabel="Add rule" busy={create.isPending} onCancel={onDone} />
    </form>
  );
}

/** Change one rule's clearances or source, with the version shown. */
export function RuleEditForm({ projectId, unit, rule, onDone }: { projectId: number; unit: LinearUnit; rule: ClearanceRuleDto; onDone: () => void }) {
  const update = useUpdateRule(projectId);
  const valuesOf = (r: ClearanceRuleDto) => ({ vertical: r.vertical, horizontal: r.horizontal, source: r.source, version: r.version });
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isDirty },
  } = useZodForm(clearanceRuleUpdateSchema, { defaultValues: valuesOf(rule) });

  const onSubmit = handleSubmit((values) =>
    update.mutate(
      { ruleId: rule.id, input: values },
      {
        onSuccess: onDone,
        // Someone else saved first: show their version (and carry its version number) before a retry.
        onError: saveErrorHandler(setError, UPDATE_FIELDS, (current: ClearanceRuleDto) => reset(valuesOf(current))),
      },
    ),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={`Edit clearance rule for ${LINE_KIND_LABELS[rule.kind]}`}>
      {update.error && <ProblemAlert error={update.error} fields={UPDATE_FIELDS} />}
      <div className="grid gap-4 sm:grid-cols-3">
        <NumberField label="Vertical clearance" unit={UNIT_SYMBOLS[unit]} required error={errors.vertical} {...register('vertical', { setValueAs: asNumberOrUndefined })} />
        <NumberField label="Horizontal clearance" unit={UNIT_SYMBOLS[unit]} required error={errors.horizontal} {...register('horizontal', { setValueAs: asNumberOrUndefined })} />
        <TextField label="Source" hint={SOURCE_HINT} error={errors.source} {...register('source', { setValueAs: asTextOrNull })} />
      </div>
      <FormActions submitLabel="Save rule" busy={update.isPending} submitDisabled={!isDirty} onCancel={onDone} />
    </form>
  );
}
