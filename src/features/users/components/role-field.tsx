import type { ComponentProps, ReactNode } from 'react';
import { ROLES, ROLE_LABELS } from '@shared/domain';
import { SelectField, SelectOptions } from '@/components/ui/field';

/** The Role select of the user forms: every role under its label. Pass `register('role')` in. */
export function RoleField(props: Omit<ComponentProps<typeof SelectField>, 'label' | 'children'> & { hint?: ReactNode }) {
  return (
    <SelectField label="Role" {...props}>
      <SelectOptions values={ROLES} labels={ROLE_LABELS} />
    </SelectField>
  );
}
