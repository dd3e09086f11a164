import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261201220525 } from './Migration20261201220525';

/** Every migration in order. Add each new one here (see DEVELOPERS.md). */
export const MIGRATIONS: MigrationObject[] = [
  { name: 'Migration20261201220525', class: Migration20261201220525 },
];
