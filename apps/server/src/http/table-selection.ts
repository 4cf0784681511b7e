import type { Request } from 'express';
import type { TableSelection } from '@seinework/contracts';
import { RequestError } from './errors';

/** `?tables=all` asks for every table of the analysis document; the default is the summary. */
export function tableSelection(request: Request): TableSelection {
  const tables = request.query['tables'];
  if (tables === undefined || tables === 'summary') return 'summary';
  if (tables === 'all') return 'all';
  throw new RequestError(400, 'tables must be "summary" (the default) or "all"');
}
