// Every entity the DataSource knows, in one list. Entities name their indexes, checks, unique and
// foreign keys as the migrations created them, so that tests/api/schema-drift.test.ts finds no
// difference; the descending order of some index columns and the lower(email) index of users live
// only in the migrations (TypeORM's index metadata does not compare them).
import { AuditEvent } from '../modules/audit/audit-event.entity';
import { UploadedFile } from '../modules/files/file.entity';
import { LIBRARY_ENTITIES } from '../modules/library/library.entity';
import { CaughtMail, MailMessage } from '../modules/mail/mail.entity';
import { Organisation } from '../modules/organisations/organisation.entity';
import { LiftPackage, Revision } from '../modules/packages/package.entity';
import { PackageStatusCount } from '../modules/packages/package-status-count.entity';
import { Assignment, DecisionRecord, Finding, Markup, StampedReturn } from '../modules/reviews/review.entity';
import { Site, SiteMember } from '../modules/sites/site.entity';
import { User } from '../modules/users/user.entity';

export const ENTITIES = [
  Organisation,
  User,
  Site,
  SiteMember,
  LiftPackage,
  Revision,
  PackageStatusCount,
  UploadedFile,
  Assignment,
  Finding,
  Markup,
  DecisionRecord,
  StampedReturn,
  AuditEvent,
  MailMessage,
  CaughtMail,
  ...LIBRARY_ENTITIES,
];
