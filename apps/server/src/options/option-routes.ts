import { Router } from 'express';
import { z } from 'zod';
import { comparisonQuerySchema, harvestOptionSchema, preferenceBodySchema, shareBodySchema } from '@seinework/contracts';
import { currentUser, requireAction } from '../auth/guards';
import type { Db } from '../db/database';
import type { EngineJobs } from '../engine/engine-jobs';
import { clientSignal } from '../http/client-signal';
import type { Notifications } from '../notifications/notification-service';
import { parseInput } from '../validate';
import { ComparisonService } from './comparison-service';
import { parseOptionBody } from './engine-problems';
import { OptionService } from './option-service';
import { PreferenceService } from './preference-service';
import { requireAnyAction } from './read-guard';
import { ShareService } from './share-service';

/**
 * Stored harvest options, council shares, preferences and comparisons (ARCH8; DEVELOPERS.md,
 * "Harvest options API"), mounted under /api. Runs and their queue are in runs/.
 */

const id = z.string().min(1).max(64);
const versionAddress = z.strictObject({ id, versionId: id });
const optionAddress = z.strictObject({ id });
const duplicateBody = z.strictObject({ name: harvestOptionSchema.shape.name.optional() });

/** Readers of options: every option, or the shared ones (the services narrow what each sees). */
const readsOptions = requireAnyAction('options.read-all', 'options.read-shared');
/** One option is also read by stakeholders: one shared for public comment (option-visibility.ts). */
const readsOption = requireAnyAction('options.read-all', 'options.read-shared', 'options.read-public');

export function optionStoreRoutes({ db, engine, notifications }: { db: Db; engine: EngineJobs; notifications?: Notifications }): Router {
  const router = Router();
  const optionService = new OptionService(db, engine);
  const shareService = new ShareService(db, optionService, notifications);
  const preferenceService = new PreferenceService(db, optionService);
  const comparisonService = new ComparisonService(db, preferenceService);

  router.post('/webs/:id/versions/:versionId/options', requireAction('options.edit'), async (request, response) => {
    const { id, versionId } = parseInput(versionAddress, request.params, 'address');
    const body = parseOptionBody(request.body);
    response.status(201).json(await optionService.create(currentUser(response), id, versionId, body, clientSignal(request, response)));
  });

  router.get('/webs/:id/versions/:versionId/options', readsOptions, async (request, response) => {
    const { id, versionId } = parseInput(versionAddress, request.params, 'address');
    response.json(await optionService.list(currentUser(response), id, versionId));
  });

  router.post('/webs/:id/versions/:versionId/options/preview', requireAction('options.edit'), async (request, response) => {
    const { id, versionId } = parseInput(versionAddress, request.params, 'address');
    const body = parseOptionBody(request.body);
    response.json(await optionService.preview(currentUser(response), id, versionId, body, clientSignal(request, response)));
  });

  router.get('/options/:id', readsOption, async (request, response) => {
    const { id } = parseInput(optionAddress, request.params, 'address');
    response.json(await optionService.detail(currentUser(response), id));
  });

  router.put('/options/:id', requireAction('options.edit'), async (request, response) => {
    const { id } = parseInput(optionAddress, request.params, 'address');
    const body = parseOptionBody(request.body);
    response.json(await optionService.update(currentUser(response), id, body, clientSignal(request, response)));
  });

  router.post('/options/:id/duplicate', requireAction('options.edit'), async (request, response) => {
    const { id } = parseInput(optionAddress, request.params, 'address');
    const { name } = parseInput(duplicateBody, request.body);
    response.status(201).json(await optionService.duplicate(currentUser(response), id, name));
  });

  router.delete('/options/:id', requireAction('options.edit'), async (request, response) => {
    const { id } = parseInput(optionAddress, request.params, 'address');
    await optionService.remove(currentUser(response), id);
    response.status(204).end();
  });

  router.post('/options/:id/shares', requireAction('options.share'), async (request, response) => {
    const { id } = parseInput(optionAddress, request.params, 'address');
    const body = parseInput(shareBodySchema, request.body);
    response.status(201).json(await shareService.share(currentUser(response), id, body));
  });

  router.delete('/shares/:id', requireAction('options.share'), async (request, response) => {
    const { id } = parseInput(optionAddress, request.params, 'address');
    await shareService.withdraw(currentUser(response), id);
    response.status(204).end();
  });

  router.post('/options/:id/preferences', requireAction('preferences.record'), async (request, response) => {
    const { id } = parseInput(optionAddress, request.params, 'address');
    const body = parseInput(preferenceBodySchema, request.body);
    response.status(201).json(await preferenceService.record(currentUser(response), id, body));
  });

  router.get('/options/:id/preferences', readsOptions, async (request, response) => {
    const { id } = parseInput(optionAddress, request.params, 'address');
    response.json(await preferenceService.ofOption(currentUser(response), id));
  });

  router.get('/comparisons', readsOptions, async (request, response) => {
    const { runs } = parseInput(comparisonQuerySchema, request.query, 'query');
    response.json(await comparisonService.compare(currentUser(response), runs));
  });

  return router;
}
