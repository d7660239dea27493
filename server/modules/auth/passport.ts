// passport-jwt reads the session token from the httpOnly cookie. The token names the
// user, their token version and the server-side session (`sid`); deactivating someone or
// signing them out everywhere bumps the version, and signing out revokes the session, so
// older tokens stop working at once. A token without `exp`, or whose `sub` or `sid` is not
// an id, is refused (401) before the database is asked.
import { createSecretKey, type KeyObject } from 'node:crypto';
import type { Request } from 'express';
import { Passport } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { DataSource } from 'typeorm';
import { User } from '../users/user.entity';
import { preparedQuery } from '../../db/prepared';
import { isUuid, LIVE_SESSION } from './sessions';

export const SESSION_COOKIE = 'cp_session';

export interface TokenPayload {
  sub: string;
  tv: number;
  sid: string;
  exp?: number;
}

export function createPassport(dataSource: DataSource, secret: string) {
  const passport = new Passport();
  // jsonwebtoken turns a string secret into a key on every verify, first by trying it as a public
  // key (a thrown and caught error): a tenth of a signed-in request's CPU. The key is made once.
  // @types/passport-jwt lists only string | Buffer for the key, jsonwebtoken takes a KeyObject:
  // handed over untyped (Reflect.apply) rather than cast.
  const key: KeyObject = createSecretKey(Buffer.from(secret));
  passport.use(
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromExtractors([
          (req: Request) => (req?.cookies?.[SESSION_COOKIE] as string | undefined) ?? null,
        ]),
        secretOrKeyProvider: (_req: Request, _token: string, done: (err: null, key: string) => void) =>
          Reflect.apply(done, undefined, [null, key]),
        algorithms: ['HS256'],
        passReqToCallback: true,
      },
      (req: Request, payload: TokenPayload, done: (err: unknown, user?: Express.User | false) => void) => {
        if (
          typeof payload?.exp !== 'number' ||
          !isUuid(payload.sub) ||
          !isUuid(payload.sid) ||
          typeof payload.tv !== 'number'
        ) {
          return done(null, false);
        }
        sessionUser(dataSource, payload)
          .then((user) => {
            if (!user) return done(null, false);
            req.sessionId = payload.sid;
            done(null, user);
          })
          .catch((err) => done(err));
      },
    ),
  );
  return passport;
}

/**
 * The signed-in person of a token, or null: the user active with the token's version, their
 * organisation, and the session live (sessions.ts LIVE_SESSION). One statement, since every
 * request asks it.
 */
async function sessionUser(dataSource: DataSource, payload: TokenPayload): Promise<Express.User | null> {
  const rows: Array<{
    id: string;
    email: string;
    name: string;
    role: Express.User['role'];
    unit_system: Express.User['unitSystem'];
    organisation_id: string;
    organisation_name: string;
    organisation_kind: Express.User['organisation']['kind'];
  }> = await preparedQuery(
    dataSource,
    `SELECT u.id, u.email, u.name, u.role, u.unit_system, o.id AS organisation_id,
            o.name AS organisation_name, o.kind AS organisation_kind
     FROM users u JOIN organisations o ON o.id = u.organisation_id
     WHERE u.id = $1 AND u.active AND u.token_version = $2
       AND EXISTS (${LIVE_SESSION})`,
    [payload.sub, payload.tv, payload.sid],
  );
  const [u] = rows;
  if (!u) return null;
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    unitSystem: u.unit_system,
    organisationId: u.organisation_id,
    organisation: { id: u.organisation_id, name: u.organisation_name, kind: u.organisation_kind },
  };
}

export function toAuthUser(user: User): Express.User {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    unitSystem: user.unitSystem,
    organisationId: user.organisationId,
    organisation: { id: user.organisation!.id, name: user.organisation!.name, kind: user.organisation!.kind },
  };
}
