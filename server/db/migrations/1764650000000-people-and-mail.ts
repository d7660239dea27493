import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Invitations, reminder choices, the mail queue's records and the local fake SMTP outbox. */
export class PeopleAndMail1764650000000 implements MigrationInterface {
  name = 'PeopleAndMail1764650000000';

  async up(q: QueryRunner): Promise<void> {
    // A contractor organisation belongs to the desk of the owner that added it.
    await q.query(
      `ALTER TABLE organisations ADD COLUMN desk_owner_id uuid REFERENCES organisations(id) ON DELETE SET NULL`,
    );
    await q.query(`ALTER TABLE users ADD COLUMN notify_reminders boolean NOT NULL DEFAULT true`);
    await q.query(`ALTER TABLE users ADD COLUMN invite_token_hash char(64)`);
    await q.query(`ALTER TABLE users ADD COLUMN invite_expires_at timestamptz`);
    await q.query(
      `CREATE UNIQUE INDEX users_invite_token_idx ON users (invite_token_hash) WHERE invite_token_hash IS NOT NULL`,
    );
    await q.query(`CREATE TABLE mail_messages (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      event varchar(40) NOT NULL,
      dedupe_key varchar(200) NOT NULL UNIQUE,
      package_id uuid REFERENCES lift_packages(id) ON DELETE SET NULL,
      recipient_id uuid REFERENCES users(id) ON DELETE SET NULL,
      to_address varchar(254) NOT NULL,
      subject varchar(300) NOT NULL,
      text_body text NOT NULL,
      html_body text NOT NULL,
      status varchar(20) NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'sent', 'failed')),
      attempts int NOT NULL DEFAULT 0,
      last_error varchar(1000),
      created_at timestamptz NOT NULL DEFAULT now(),
      sent_at timestamptz)`);
    await q.query(`CREATE INDEX mail_messages_status_idx ON mail_messages (status, created_at DESC)`);
    await q.query(`CREATE TABLE caught_mail (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      message_id varchar(300),
      envelope_from varchar(300) NOT NULL,
      envelope_to text[] NOT NULL,
      subject varchar(300) NOT NULL DEFAULT '',
      text_body text NOT NULL DEFAULT '',
      html_body text,
      raw_size int NOT NULL,
      received_at timestamptz NOT NULL DEFAULT now())`);
    await q.query(`CREATE INDEX caught_mail_received_idx ON caught_mail (received_at DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS caught_mail`);
    await q.query(`DROP TABLE IF EXISTS mail_messages`);
    await q.query(`DROP INDEX IF EXISTS users_invite_token_idx`);
    await q.query(
      `ALTER TABLE users DROP COLUMN invite_expires_at, DROP COLUMN invite_token_hash, DROP COLUMN notify_reminders`,
    );
    await q.query(`ALTER TABLE organisations DROP COLUMN desk_owner_id`);
  }
}
