import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261201220525 } from './Migration20261201220525';
import { Migration20261201224256 } from './Migration20261201224256';
import { Migration20261201224540 } from './Migration20261201224540';
import { Migration20261202005913 } from './Migration20261202005913';

/** Every migration in order. Add each new one here (see DEVELOPERS.md). */
export const MIGRATIONS: MigrationObject[] = [
  { name: 'Migration20261201220525', class: Migration20261201220525 },
  { name: 'Migration20261201224256', class: Migration20261201224256 },
  { name: 'Migration20261201224540', class: Migration20261201224540 },
  { name: 'Migration20261202005913', class: Migration20261202005913 },
];
