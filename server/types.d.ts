// Request augmentations: the signed-in user and the values validate() parsed.
import type { OrganisationKind, Role, UnitSystem } from '@shared/schemas/common';

declare global {
  namespace Express {
    interface User {
      id: string;
      email: string;
      name: string;
      role: Role;
      unitSystem: UnitSystem;
      organisationId: string;
      organisation: { id: string; name: string; kind: OrganisationKind };
    }
    interface Request {
      valid?: Record<string, unknown>;
      /** The server-side session the token names (set by passport). */
      sessionId?: string;
    }
  }
}

export {};
