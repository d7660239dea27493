// The person a service acts for: what the domain needs to know about them (who, which role,
// which organisation, the name written into records). Routes turn the signed-in session into
// an Actor once (server/middleware/auth.ts currentActor); services never see Express types.
import type { OrganisationKind, Role } from '../schemas/common';

export interface Actor {
  id: string;
  role: Role;
  organisationId: string;
  /** the owner's desk or a contractor */
  organisationKind: OrganisationKind;
  name: string;
}
