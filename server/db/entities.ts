// Every entity the DataSource knows, in one list.
import { AuditEvent } from '../modules/audit/audit-event.entity';
import { UploadedFile } from '../modules/files/file.entity';
import { LIBRARY_ENTITIES } from '../modules/library/library.entity';
import { CaughtMail, MailMessage } from '../modules/mail/mail.entity';
import { Organisation } from '../modules/organisations/organisation.entity';
import { LiftPackage, Revision } from '../modules/packages/package.entity';
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
