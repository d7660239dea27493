// Sign-in payloads and the signed-in user as the API returns it.
import { z } from 'zod';
import { OrganisationKind, Role, UnitSystem } from './common';

export const SignInBody = z.object({
  email: z.email({ message: 'email must be a valid e-mail address' }).max(254),
  password: z.string().min(1, 'password is required').max(200, 'password must be at most 200 characters'),
});
export type SignInBody = z.infer<typeof SignInBody>;

export const CurrentUser = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: Role,
  unitSystem: UnitSystem,
  organisation: z.object({ id: z.uuid(), name: z.string(), kind: OrganisationKind }),
});
export type CurrentUser = z.infer<typeof CurrentUser>;

export const MeResponse = z.object({ user: CurrentUser });
export type MeResponse = z.infer<typeof MeResponse>;
