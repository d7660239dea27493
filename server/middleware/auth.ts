// requireAuth answers 401 in the JSON error shape when the session cookie is missing,
// expired or revoked; requireRole answers 403 for a role the route does not allow.
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { PassportStatic } from 'passport';
import type { Actor } from '@shared/rules/actor';
import type { Role } from '@shared/schemas/common';
import { AppError } from '../lib/app-error';

export function requireAuth(passport: PassportStatic): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    passport.authenticate(
      'jwt',
      { session: false },
      (err: unknown, user: Express.User | false, info?: Error) => {
        if (err) return next(err);
        if (!user) {
          const expired = info?.name === 'TokenExpiredError';
          return next(
            new AppError(
              401,
              expired ? 'session_expired' : 'unauthenticated',
              expired ? 'Your session has expired. Sign in again.' : 'Sign in to continue.',
            ),
          );
        }
        req.user = user;
        next();
      },
    )(req, res, next);
  };
}

export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(AppError.unauthorised());
    if (!roles.includes(req.user.role)) {
      return next(
        AppError.forbidden(
          `This needs the role ${roles.join(' or ')}; you are signed in as ${req.user.role}.`,
        ),
      );
    }
    next();
  };
}

/** The signed-in user as the domain's Actor: what routes hand to services. */
export function currentActor(req: Request): Actor {
  const user = currentUser(req);
  return {
    id: user.id,
    role: user.role,
    organisationId: user.organisationId,
    organisationKind: user.organisation.kind,
    name: user.name,
  };
}

/** The signed-in user of a route behind requireAuth. */
export function currentUser(req: Request): Express.User {
  if (!req.user) throw AppError.unauthorised();
  return req.user;
}

/** Reads the session when there is a valid one and carries on either way (sign-out). */
export function optionalSession(ctx: { passport: PassportStatic }): RequestHandler {
  return (req, res, next) => {
    ctx.passport.authenticate('jwt', { session: false }, (err: unknown, user: Express.User | false) => {
      if (err) return next(err);
      if (user) req.user = user;
      next();
    })(req, res, next);
  };
}
