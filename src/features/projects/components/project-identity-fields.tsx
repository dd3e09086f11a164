import type { FieldError, UseFormRegisterReturn } from 'react-hook-form';
import { TextAreaField, TextField } from '@/components/ui/field';

/**
 * The project's name, client and description, as the New project and Project settings forms
 * both show them. Each form registers the fields itself (`register('name')`, and `description`
 * with `setValueAs: asTextOrNull`), since their schemas differ.
 */
export function ProjectIdentityFields({ name, client, description, errors }: {
  name: UseFormRegisterReturn<'name'>;
  client: UseFormRegisterReturn<'client'>;
  description: UseFormRegisterReturn<'description'>;
  errors: { name?: FieldError; client?: FieldError; description?: FieldError };
}) {
  return (
    <>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Project name" required error={errors.name} {...name} />
        <TextField label="Client" required error={errors.client} {...client} />
      </div>
      <TextAreaField label="Description" error={errors.description} {...description} />
    </>
  );
}
