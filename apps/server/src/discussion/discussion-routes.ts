import { Router } from 'express';
import { z } from 'zod';
import { commentBodySchema, commentEditSchema, hideCommentSchema } from '@seinework/contracts';
import { currentUser, requireAction } from '../auth/guards';
import type { Db } from '../db/database';
import type { EngineJobs } from '../engine/engine-jobs';
import { RequestError } from '../http/errors';
import type { Notifications } from '../notifications/notification-service';
import { OptionService } from '../options/option-service';
import { requireAnyAction } from '../options/read-guard';
import { parseInput } from '../validate';
import { DiscussionService } from './discussion-service';

/**
 * The discussion of shared options (DEVELOPERS.md, "Discussion"), mounted under /api: comments
 * (list, post, edit, hide), following an option's discussion, and the list of discussions.
 */

const id = z.string().min(1).max(64);
const address = z.strictObject({ id });
const pageQuery = z.strictObject({
  page: z.coerce.number({ error: 'page must be a whole number from 1' }).int('page must be a whole number from 1').min(1, 'page must be a whole number from 1').max(100_000, 'page must be at most 100000').default(1),
});
/** Who reads discussions: whoever reads options (every one, the shared ones, or those shared for public comment). */
const readsDiscussions = requireAnyAction('options.read-all', 'options.read-shared', 'options.read-public');

/** A comment the schema refuses (too long, empty, control characters, …) is well-formed JSON with unacceptable content: 422. */
function parseComment<S extends z.ZodType>(schema: S, body: unknown): z.output<S> {
  try {
    return parseInput(schema, body);
  } catch (error) {
    if (error instanceof RequestError && error.status === 400) throw new RequestError(422, 'The comment is not acceptable', error.details);
    throw error;
  }
}

export function discussionRoutes({ db, engine, notifications }: { db: Db; engine: EngineJobs; notifications?: Notifications }): Router {
  const router = Router();
  const service = new DiscussionService(db, new OptionService(db, engine), notifications);

  router.get('/options/:id/comments', readsDiscussions, async (request, response) => {
    const { id: optionId } = parseInput(address, request.params, 'address');
    const { page } = parseInput(pageQuery, request.query, 'query');
    response.json(await service.list(currentUser(response), optionId, page));
  });

  router.post('/options/:id/comments', requireAction('comments.post'), async (request, response) => {
    const { id: optionId } = parseInput(address, request.params, 'address');
    const body = parseComment(commentBodySchema, request.body);
    response.status(201).json(await service.post(currentUser(response), optionId, body));
  });

  router.patch('/comments/:id', requireAction('comments.post'), async (request, response) => {
    const { id: commentId } = parseInput(address, request.params, 'address');
    const { text } = parseComment(commentEditSchema, request.body);
    response.json(await service.edit(currentUser(response), commentId, text));
  });

  router.post('/comments/:id/hide', requireAction('comments.moderate'), async (request, response) => {
    const { id: commentId } = parseInput(address, request.params, 'address');
    const { reason } = parseInput(hideCommentSchema, request.body);
    response.json(await service.hide(currentUser(response), commentId, reason));
  });

  router.put('/options/:id/follow', readsDiscussions, async (request, response) => {
    const { id: optionId } = parseInput(address, request.params, 'address');
    response.json(await service.follow(currentUser(response), optionId, true));
  });

  router.delete('/options/:id/follow', readsDiscussions, async (request, response) => {
    const { id: optionId } = parseInput(address, request.params, 'address');
    response.json(await service.follow(currentUser(response), optionId, false));
  });

  router.get('/discussions', readsDiscussions, async (_request, response) => {
    response.json(await service.discussions(currentUser(response)));
  });

  return router;
}
