import type { RequestHandler } from 'express';
import type { SessionStore } from '../auth/session-store';

/** Reads the session cookie, validates it, refreshes it when lucia says so, and exposes the user. */
export function authenticate(sessions: SessionStore): RequestHandler {
  return async (req, res, next) => {
    const sessionId = sessions.readSessionCookie(req.headers.cookie ?? '');
    res.locals.user = null;
    res.locals.session = null;
    if (!sessionId) return next();
    const { session, user } = await sessions.validateSession(sessionId);
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
