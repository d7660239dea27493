// passport-jwt reads the session token from the httpOnly cookie. The token names the
// user and their token version; deactivating someone or signing them out everywhere
// bumps the version, so older tokens stop working at once.
import type { Request } from 'express';
import { Passport } from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { DataSource } from 'typeorm';
import { User } from '../users/user.entity';

export const SESSION_COOKIE = 'cp_session';

export interface TokenPayload {
  sub: string;
  tv: number;
}

export function createPassport(dataSource: DataSource, secret: string) {
  const passport = new Passport();
  passport.use(
    new JwtStrategy(
      {
        jwtFromRequest: ExtractJwt.fromExtractors([
          (req: Request) => (req?.cookies?.[SESSION_COOKIE] as string | undefined) ?? null,
        ]),
        secretOrKey: secret,
        algorithms: ['HS256'],
      },
      (payload: TokenPayload, done: (err: unknown, user?: Express.User | false) => void) => {
        dataSource
          .getRepository(User)
          .findOne({ where: { id: payload.sub }, relations: { organisation: true } })
          .then((user) => {
            if (!user || !user.active || user.tokenVersion !== payload.tv || !user.organisation) {
              return done(null, false);
            }
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
