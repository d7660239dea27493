// An uploaded PDF: its bytes live behind the storage interface under storage_key.
import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  ForeignKey,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryGeneratedColumn,
} from 'typeorm';
import type { PdfContents } from '@shared/schemas/packages';
import { User } from '../users/user.entity';
import { Revision } from '../packages/package.entity';

export type FileKind = 'lift_plan' | 'supporting';

@Index('uploaded_files_revision_idx', ['revisionId'])
@Index('uploaded_files_uploaded_by_idx', ['uploadedById'])
@Index('uploaded_files_carried_from_idx', ['carriedFromId'])
@Index('uploaded_files_storage_key_idx', ['storageKey'])
// One lift plan per revision (migration OneLiftPlan1764720200000).
@Index('uploaded_files_one_lift_plan_key', ['revisionId'], { unique: true, where: "kind = 'lift_plan'" })
@Entity({ name: 'uploaded_files' })
@Check('uploaded_files_kind_check', `kind IN ('lift_plan', 'supporting')`)
export class UploadedFile {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'revision_id' }) revisionId: string;
  @ManyToOne(() => Revision, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'revision_id', foreignKeyConstraintName: 'uploaded_files_revision_id_fkey' })
  revision?: Revision;
  @Column({ type: 'varchar', length: 20 }) kind: FileKind;
  @Column({ type: 'varchar', length: 255, name: 'original_name' }) originalName: string;
  @Column({ type: 'char', length: 64 }) sha256: string;
  @Column({ type: 'bigint', name: 'size_bytes' }) sizeBytes: string;
  @Column({ type: 'int' }) pages: number;
  @Column({ type: 'varchar', length: 300, name: 'storage_key' }) storageKey: string;
  @ForeignKey(() => User, { name: 'uploaded_files_uploaded_by_id_fkey' })
  @Column({ type: 'uuid', name: 'uploaded_by_id' })
  uploadedById: string;
  /** The previous revision's row this one was carried over from (migration CarriedDocuments1764724000000). */
  @ForeignKey(() => UploadedFile, { name: 'uploaded_files_carried_from_id_fkey', onDelete: 'SET NULL' })
  @Column({ type: 'uuid', name: 'carried_from_id', nullable: true })
  carriedFromId: string | null;
  @Column({ type: 'int', name: 'carried_from_revision', nullable: true }) carriedFromRevision: number | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  /** What the PDF carries besides page content, found at upload (migration UploadContents1764722000000); null before. */
  @Column({ type: 'jsonb', nullable: true }) contents: PdfContents | null;
}
