import { Migration } from '@mikro-orm/migrations';

/**
 * Test-hole sheet fields (soil, groundwater, restoration) and photo processing: where the
 * capture time and position came from, the device fix's accuracy, the upright copy's key and
 * the processing state (existing photos are ready).
 */
export class Migration20261201224256 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table \`test_holes\` add column \`soil\` text null;`);
    this.addSql(`alter table \`test_holes\` add column \`groundwater\` text null;`);
    this.addSql(`alter table \`test_holes\` add column \`restoration\` text null;`);

    this.addSql(`alter table \`photos\` add column \`taken_at_source\` text check (\`taken_at_source\` in ('exif', 'device')) null;`);
    this.addSql(`alter table \`photos\` add column \`gps_source\` text check (\`gps_source\` in ('exif', 'device')) null;`);
    this.addSql(`alter table \`photos\` add column \`gps_accuracy\` double null;`);
    this.addSql(`alter table \`photos\` add column \`display_key\` text null;`);
    this.addSql(`alter table \`photos\` add column \`state\` text check (\`state\` in ('processing', 'ready', 'failed')) not null default 'ready';`);
  }

}
