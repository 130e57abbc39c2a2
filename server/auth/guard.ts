/**
 * Reads the signed-in member for every request, and the role checks routes declare.
 * The user is read from the database on each request, so disabling a member or changing
 * their role takes effect at once, on every app process.
 */
import type { RequestHandler } from 'express';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { organisations, users } from '../db/schema.js';
import type { Role } from '../../shared/schemas/auth.js';
import { forbidden, unauthorised } from '../errors.js';

export function loadUser(db: Db): RequestHandler {
  return async (req, _res, next) => {
    const userId = req.session?.userId;
    if (!userId) return next();
    const [row] = await db
      .select({
        id: users.id,
        email: users.email,
        name: users.name,
        role: users.role,
        disabled: users.disabled,
        organisationId: users.organisationId,
        organisationName: organisations.name,
      })
      .from(users)
      .innerJoin(organisations, eq(organisations.id, users.organisationId))
      .where(eq(users.id, userId))
      .limit(1);
    if (!row || row.disabled) {
      delete req.session.userId;
      return next();
    }
    const { disabled: _d, ...user } = row;
    req.user = user;
    next();
  };
}

export const requireUser: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : unauthorised());
};

/** Allows only the roles listed; a signed-out request gets 401, a weaker role 403. */
export function requireRole(...allowed: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthorised());
    if (!allowed.includes(req.user.role)) return next(forbidden(`This needs the ${allowed.join(' or ')} role`));
    next();
  };
}

/** Who may change boards and print history: owners and electricians. */
export const canEdit = requireRole('owner', 'electrician');
export const ownerOnly = requireRole('owner');
