import type { RequestHandler, Response } from 'express';
import { can, type Action, type CurrentUser } from '@seinework/contracts';
import { RequestError } from '../http/errors';
import type { Sessions } from './session';

/** Puts the signed-in person (if any) in response.locals.user and keeps the session cookie fresh. */
export function sessionReader(sessions: Sessions): RequestHandler {
  return async (request, response, next) => {
    const valid = await sessions.validate(request.headers.cookie);
    if (valid) {
      response.locals['user'] = valid.user;
      response.locals['sessionId'] = valid.sessionId;
      if (valid.refreshedCookie) response.append('Set-Cookie', valid.refreshedCookie);
    }
    next();
  };
}

/** 401 unless someone is signed in. */
export const requireSignIn: RequestHandler = (_request, response, next) => {
  if (!response.locals['user']) return next(new RequestError(401, 'Sign in first'));
  next();
};

/** 401 signed out, 403 unless the person's role may take the action (the table in libs/contracts/src/roles.ts). */
export function requireAction(action: Action): RequestHandler {
  return (_request, response, next) => {
    const user = response.locals['user'] as CurrentUser | undefined;
    if (!user) return next(new RequestError(401, 'Sign in first'));
    if (!can(user.role, action)) return next(new RequestError(403, `Your role (${user.role}) may not do this: ${action}`));
    next();
  };
}

/** The signed-in person; only after requireSignIn or requireAction. */
export function currentUser(response: Response): CurrentUser {
  const user = response.locals['user'] as CurrentUser | undefined;
  if (!user) throw new RequestError(401, 'Sign in first');
  return user;
}

/** The id of the session the request came with; only after requireSignIn or requireAction. */
export function currentSessionId(response: Response): string {
  return response.locals['sessionId'] as string;
}
