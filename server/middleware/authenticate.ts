import type { RequestHandler } from 'express';
import type { SessionStore } from '../auth/session-store';

export interface SessionLimits {
  /** A session ends this long after sign-in, however much it is used (the idle limit is lucia's sliding expiry). */
  absoluteMs: number;
  /** The clock, so tests can move it. */
  now?: () => number;
}

/**
 * Reads the session cookie, validates it (unknown, idle past its expiry, older than the absolute limit, or of a
 * deactivated account: refused and the cookie cleared), refreshes it when lucia says so, and exposes the user.
 */
export function authenticate(sessions: SessionStore, limits: SessionLimits): RequestHandler {
  const now = limits.now ?? Date.now;
  return async (req, res, next) => {
    const sessionId = sessions.readSessionCookie(req.headers.cookie ?? '');
    res.locals.user = null;
    res.locals.session = null;
    if (!sessionId) return next();
    const { session, user } = await sessions.validateSession(sessionId);
    if (session && session.createdAt.getTime() + limits.absoluteMs <= now()) {
      await sessions.invalidateSession(session.id);
      res.append('Set-Cookie', sessions.createBlankSessionCookie().serialize());
      return next();
    }
    if (!session) {
      res.append('Set-Cookie', sessions.createBlankSessionCookie().serialize());
      return next();
    }
    if (session.fresh) res.append('Set-Cookie', sessions.createSessionCookie(session.id).serialize());
    res.locals.session = session;
    res.locals.user = { id: user.id, email: user.email, displayName: user.displayName, role: user.role };
    next();
  };
}
