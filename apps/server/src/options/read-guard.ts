import type { RequestHandler } from 'express';
import { can, type Action, type CurrentUser } from '@seinework/contracts';
import { RequestError } from '../http/errors';

/**
 * 401 signed out, 403 unless the person's role may take one of the actions: options are read by
 * those who read every option and by those who read shared ones (which ones, the services decide).
 */
export function requireAnyAction(...actions: Action[]): RequestHandler {
  return (_request, response, next) => {
    const user = response.locals['user'] as CurrentUser | undefined;
    if (!user) return next(new RequestError(401, 'Sign in first'));
    if (!actions.some((action) => can(user.role, action))) return next(new RequestError(403, `Your role (${user.role}) may not do this: ${actions.join(' or ')}`));
    next();
  };
}
