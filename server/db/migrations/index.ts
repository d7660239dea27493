// Migrations in the order they run. Add new ones at the end (see DEVELOPERS.md).
import { InitialSchema1764633600000 } from './1764633600000-initial-schema';
import { QueueIndexes1764633700000 } from './1764633700000-queue-indexes';
import { ReviewDesk1764640000000 } from './1764640000000-review-desk';
import { PeopleAndMail1764650000000 } from './1764650000000-people-and-mail';
import { JobIntents1764670000000 } from './1764670000000-job-intents';
import { ReturnSignature1764690000000 } from './1764690000000-return-signature';
import { Sessions1764700000000 } from './1764700000000-sessions';
import { SealedInviteLinks1764715000000 } from './1764715000000-sealed-invite-links';
import { FleetLibrary1764717000000 } from './1764717000000-fleet-library';
import { ForeignKeyIndexes1764718000000 } from './1764718000000-foreign-key-indexes';
import { DeliberateDecision1764720100000 } from './1764720100000-deliberate-decision';
import { OneLiftPlan1764720200000 } from './1764720200000-one-lift-plan';
import { DocumentUnits1764720300000 } from './1764720300000-document-units';
import { QueueAtScale1764721000000 } from './1764721000000-queue-at-scale';
import { UploadContents1764722000000 } from './1764722000000-upload-contents';
import { StampPlacement1764723000000 } from './1764723000000-stamp-placement';
import { CarriedDocuments1764724000000 } from './1764724000000-carried-documents';
import { LiveUpdates1764724100000 } from './1764724100000-live-updates';
import { AssignmentNote1764724200000 } from './1764724200000-assignment-note';
import { ReviewDue1764724300000 } from './1764724300000-review-due';

export const MIGRATIONS = [
  InitialSchema1764633600000,
  QueueIndexes1764633700000,
  ReviewDesk1764640000000,
  PeopleAndMail1764650000000,
  JobIntents1764670000000,
  ReturnSignature1764690000000,
  Sessions1764700000000,
  SealedInviteLinks1764715000000,
  FleetLibrary1764717000000,
  ForeignKeyIndexes1764718000000,
  DeliberateDecision1764720100000,
  OneLiftPlan1764720200000,
  DocumentUnits1764720300000,
  QueueAtScale1764721000000,
  UploadContents1764722000000,
  StampPlacement1764723000000,
  CarriedDocuments1764724000000,
  LiveUpdates1764724100000,
  AssignmentNote1764724200000,
  ReviewDue1764724300000,
];
