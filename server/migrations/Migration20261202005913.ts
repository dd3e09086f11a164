import { Migration } from '@mikro-orm/migrations';

/**
 * Photos keep the id the phone made when the photo was picked, unique per hole, so a resent
 * upload answers the photo already kept instead of storing a second copy. Null for uploads sent
 * without one (older clients, the office), which SQLite's unique index allows any number of.
 * The generator also proposed rebuilding every table with an enum check constraint: those are its
 * known false positives on SQLite (see tests/server/migrations.test.ts), removed here.
 */
export class Migration20261202005913 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`photos\` add column \`client_id\` text null;`);
    this.addSql(`create unique index \`photos_hole_id_client_id_unique\` on \`photos\` (\`hole_id\`, \`client_id\`);`);
  }

}
