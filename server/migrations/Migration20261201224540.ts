import { Migration } from '@mikro-orm/migrations';

/**
 * Stake-out marks (which points were staked, when and by whom, and where the point was) and the
 * mail outbox (every message kept until the SMTP server accepts it). The generator also proposed
 * rebuilding every table with an enum check constraint: those are its known false positives on
 * SQLite (see tests/server/migrations.test.ts), removed here.
 */
export class Migration20261201224540 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table \`stake_marks\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`project_id\` integer not null, \`kind\` text not null, \`key\` text not null, \`staked_at\` datetime not null, \`staked_by_id\` integer null, \`note\` text null, \`easting\` double not null, \`northing\` double not null, \`elevation\` double null, constraint \`stake_marks_project_id_foreign\` foreign key(\`project_id\`) references \`projects\`(\`id\`) on delete cascade on update cascade, constraint \`stake_marks_staked_by_id_foreign\` foreign key(\`staked_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`);
    this.addSql(`create index \`stake_marks_project_id_index\` on \`stake_marks\` (\`project_id\`);`);
    this.addSql(`create index \`stake_marks_staked_by_id_index\` on \`stake_marks\` (\`staked_by_id\`);`);
    this.addSql(`create unique index \`stake_marks_project_id_key_unique\` on \`stake_marks\` (\`project_id\`, \`key\`);`);

    this.addSql(`create table \`outbox_messages\` (\`id\` integer not null primary key autoincrement, \`created_at\` datetime not null, \`updated_at\` datetime not null, \`project_id\` integer null, \`purpose\` text not null, \`to_address\` text not null, \`reply_to\` text null, \`subject\` text not null, \`text\` text not null, \`attachments\` json not null, \`status\` text check (\`status\` in ('queued', 'sent', 'failed')) not null, \`attempts\` integer not null, \`next_attempt_at\` datetime null, \`last_error\` text null, \`sent_at\` datetime null, \`message_id\` text null, \`created_by_id\` integer null, \`dedupe_key\` text null, constraint \`outbox_messages_project_id_foreign\` foreign key(\`project_id\`) references \`projects\`(\`id\`) on delete set null on update cascade, constraint \`outbox_messages_created_by_id_foreign\` foreign key(\`created_by_id\`) references \`users\`(\`id\`) on delete set null on update cascade);`);
    this.addSql(`create index \`outbox_messages_project_id_index\` on \`outbox_messages\` (\`project_id\`);`);
    this.addSql(`create index \`outbox_messages_created_by_id_index\` on \`outbox_messages\` (\`created_by_id\`);`);
    this.addSql(`create unique index \`outbox_messages_dedupe_key_unique\` on \`outbox_messages\` (\`dedupe_key\`);`);
    this.addSql(`create index \`outbox_messages_status_next_attempt_at_index\` on \`outbox_messages\` (\`status\`, \`next_attempt_at\`);`);
  }

}
