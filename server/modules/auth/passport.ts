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
import { isUuid, sessionIsLive } from './sessions';

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
        Promise.all([
          dataSource
            .getRepository(User)
            .findOne({ where: { id: payload.sub }, relations: { organisation: true } }),
          sessionIsLive(dataSource, payload.sid, payload.sub),
        ])
          .then(([user, live]) => {
            if (!live || !user || !user.active || user.tokenVersion !== payload.tv || !user.organisation) {
              return done(null, false);
            }
            req.sessionId = payload.sid;
            done(null, toAuthUser(user));
          })
          .catch((err) => done(err));
      },
    ),
  );
  return passport;
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
