// Mail the desk sends (one row per recipient and event, deduplicated by key) and, for the
// embedded set-up, what the local fake SMTP server received.
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  ForeignKey,
  Index,
  PrimaryGeneratedColumn,
  Unique,
} from 'typeorm';
import { LiftPackage } from '../packages/package.entity';
import { User } from '../users/user.entity';

export type MailEvent =
  | 'submitted'
  | 'assigned'
  | 'decided'
  | 'returned'
  | 'answered'
  | 'resubmitted'
  | 'reminder'
  | 'review_due'
  | 'invite';

@Index('mail_messages_package_idx', ['packageId'])
@Index('mail_messages_recipient_idx', ['recipientId'])
// The person's unread hand-offs (migration LiveUpdates1764724100000).
@Index('mail_messages_recipient_unread_idx', ['recipientId', 'createdAt'], { where: 'read_at IS NULL' })
@Entity({ name: 'mail_messages' })
@Check('mail_messages_status_check', `status IN ('queued', 'sent', 'failed')`)
@Index('mail_messages_status_idx', ['status', 'createdAt'])
@Unique('mail_messages_dedupe_key_key', ['dedupeKey'])
export class MailMessage {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 40 }) event: MailEvent;
  @Column({ type: 'varchar', length: 200, name: 'dedupe_key' }) dedupeKey: string;
  @ForeignKey(() => LiftPackage, { name: 'mail_messages_package_id_fkey', onDelete: 'SET NULL' })
  @Column({ type: 'uuid', name: 'package_id', nullable: true })
  packageId: string | null;
  @ForeignKey(() => User, { name: 'mail_messages_recipient_id_fkey', onDelete: 'SET NULL' })
  @Column({ type: 'uuid', name: 'recipient_id', nullable: true })
  recipientId: string | null;
  @Column({ type: 'varchar', length: 254, name: 'to_address' }) toAddress: string;
  @Column({ type: 'varchar', length: 300 }) subject: string;
  @Column({ type: 'text', name: 'text_body' }) textBody: string;
  @Column({ type: 'text', name: 'html_body' }) htmlBody: string;
  /** An invitation's link, sealed until the message is sent (see sealed-link.ts); never shown. */
  @Column({ type: 'text', name: 'sealed_link', nullable: true }) sealedLink: string | null;
  @Column({ type: 'varchar', length: 20, default: 'queued' }) status: 'queued' | 'sent' | 'failed';
  @Column({ type: 'int', default: 0 }) attempts: number;
  @Column({ type: 'varchar', length: 1000, name: 'last_error', nullable: true }) lastError: string | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @Column({ type: 'timestamptz', name: 'sent_at', nullable: true }) sentAt: Date | null;
  /** When the recipient marked it read in the desk's list of hand-offs. */
  @Column({ type: 'timestamptz', name: 'read_at', nullable: true }) readAt: Date | null;
}

@Entity({ name: 'caught_mail' })
@Index('caught_mail_received_idx', ['receivedAt'])
export class CaughtMail {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'varchar', length: 300, name: 'message_id', nullable: true }) messageId: string | null;
  @Column({ type: 'varchar', length: 300, name: 'envelope_from' }) envelopeFrom: string;
  @Column({ type: 'text', array: true, name: 'envelope_to' }) envelopeTo: string[];
  @Column({ type: 'varchar', length: 300, default: '' }) subject: string;
  @Column({ type: 'text', name: 'text_body', default: '' }) textBody: string;
  @Column({ type: 'text', name: 'html_body', nullable: true }) htmlBody: string | null;
  @Column({ type: 'int', name: 'raw_size' }) rawSize: number;
  @CreateDateColumn({ type: 'timestamptz', name: 'received_at' }) receivedAt: Date;
}
