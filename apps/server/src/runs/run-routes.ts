import { Router, type Response } from 'express';
import { z } from 'zod';
import { runBodySchema, type CurrentUser, type RunSummary } from '@seinework/contracts';
import { currentUser, requireAction } from '../auth/guards';
import type { Db } from '../db/database';
import { requireAnyAction } from '../options/read-guard';
import { sendJsonText } from '../http/client-signal';
import { tableSelection } from '../http/table-selection';
import { parseInput } from '../validate';
import { resultText } from './result-text';
import type { RunQueue } from './run-queue';
import { RunService, TERMINAL } from './run-service';

/**
 * Runs of stored harvest options (ARCH8; DEVELOPERS.md, "Runs and their queue"), mounted under /api:
 * start (202, queued), read (the result without the n² tables unless `?tables=all`, as the
 * analysis routes answer), follow as server-sent events, cancel, list an option's runs.
 */

const id = z.string().min(1).max(64);
const address = z.strictObject({ id });
const readsRuns = requireAnyAction('options.read-all', 'options.read-shared');
/** A run is also read by stakeholders: the one a share for public comment shows (options/option-visibility.ts). */
const readsRun = requireAnyAction('options.read-all', 'options.read-shared', 'options.read-public');

/** How often the events stream looks at the row: a run computed by another server process has no in-process news. */
const EVENT_POLL_MS = 500;

export function runRoutes({ db, queue }: { db: Db; queue: RunQueue }): Router {
  const router = Router();
  const service = new RunService(db, queue);

  router.post('/options/:id/runs', requireAction('options.edit'), async (request, response) => {
    const { id: optionId } = parseInput(address, request.params, 'address');
    const body = parseInput(runBodySchema, request.body ?? {});
    response.status(202).json(await service.start(currentUser(response), optionId, body));
  });

  router.get('/options/:id/runs', readsRuns, async (request, response) => {
    const { id: optionId } = parseInput(address, request.params, 'address');
    response.json(await service.listForOption(currentUser(response), optionId));
  });

  router.get('/runs/:id', readsRun, async (request, response) => {
    const { id: runId } = parseInput(address, request.params, 'address');
    const tables = tableSelection(request);
    const detail = await service.detail(currentUser(response), runId);
    if (detail.status !== 'done') return void response.json(detail);
    // the stored document as text, spliced in: a stored run is read without parsing or serialising it
    const head = JSON.stringify(detail);
    sendJsonText(response, Buffer.from(`${head.slice(0, -1)},"result":${await resultText(db, runId, tables)}}`));
  });

  router.post('/runs/:id/cancel', requireAction('options.edit'), async (request, response) => {
    const { id: runId } = parseInput(address, request.params, 'address');
    response.json(await service.cancel(currentUser(response), runId));
  });

  router.get('/runs/:id/events', readsRuns, async (request, response) => {
    const { id: runId } = parseInput(address, request.params, 'address');
    const user = currentUser(response);
    // 404 before the stream opens
    const first = await service.summary(user, runId);
    streamEvents(response, user, runId, first, service, queue);
  });

  return router;
}

/**
 * `event: progress` with the run in brief whenever its progress moves, `event: status` when its
 * status changes, and the stream ends after the status done, failed or cancelled. News comes from
 * this process's queue at once, and from the row every EVENT_POLL_MS for runs other processes compute.
 */
function streamEvents(response: Response, user: CurrentUser, runId: string, first: RunSummary, service: RunService, queue: RunQueue): void {
  response.writeHead(200, { 'Content-Type': 'text/event-stream; charset=utf-8', 'Cache-Control': 'no-store', Connection: 'keep-alive', 'X-Accel-Buffering': 'no' });
  let last: RunSummary | undefined;
  let closed = false;
  let looking = false;
  let again = false;
  const send = (summary: RunSummary) => {
    const statusChanged = last?.status !== summary.status;
    if (!statusChanged && last?.progress.done === summary.progress.done) return;
    last = summary;
    response.write(`event: ${statusChanged ? 'status' : 'progress'}\ndata: ${JSON.stringify(summary)}\n\n`);
    if (TERMINAL.has(summary.status)) close();
  };
  const look = async () => {
    if (closed) return;
    if (looking) {
      again = true;
      return;
    }
    looking = true;
    try {
      send(await service.summary(user, runId));
    } catch {
      // the run or the option went (deleted): nothing more to tell
      close();
    } finally {
      looking = false;
    }
    if (again) {
      again = false;
      void look();
    }
  };
  const onChange = (changed: string) => changed === runId && void look();
  const timer = setInterval(() => void look(), EVENT_POLL_MS);
  function close() {
    if (closed) return;
    closed = true;
    clearInterval(timer);
    queue.events.off('changed', onChange);
    response.end();
  }
  queue.events.on('changed', onChange);
  response.on('close', close);
  send(first);
}
