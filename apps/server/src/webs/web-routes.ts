import { Router, type Request } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { balancePreviewBodySchema, cloneBodySchema, newVersionBodySchema, uploadFieldsSchema, webDetailsSchema, webListQuerySchema } from '@seinework/contracts';
import { createWorkerPool } from '@seinework/draw-pool';
import { MAX_UPLOAD_BYTES, MAX_UPLOAD_FILES, type WebRead } from '@seinework/web-tables';
import { currentUser, requireAction } from '../auth/guards';
import { requireAnyAction } from '../options/read-guard';
import type { Db } from '../db/database';
import type { EngineJobs } from '../engine/engine-jobs';
import { clientSignal } from '../http/client-signal';
import { RequestError } from '../http/errors';
import { tableSelection } from '../http/table-selection';
import { parseInput } from '../validate';
import { balancePreview } from './balance-preview';
import { EXPORT_FORMATS, exportFile } from './export-file';
import type { UploadTask } from './upload-worker';
import { versionAnalysis } from './version-analysis';
import { checkedWeb, WebService } from './web-service';

/** `/api/webs`: stored webs and their versions (DEVELOPERS.md, "Webs API"). */

const webAddress = z.strictObject({ id: z.string().min(1).max(64) });
const versionAddress = z.strictObject({ id: z.string().min(1).max(64), versionId: z.string().min(1).max(64) });
const exportQuery = z.strictObject({ format: z.enum(EXPORT_FORMATS, { error: `format must be one of ${EXPORT_FORMATS.join(', ')}` }).default('json') });

/** Files are kept in memory (5 MB at most) and never written to disk. */
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_UPLOAD_BYTES, files: MAX_UPLOAD_FILES, fields: 10, fieldSize: 10_000, parts: 20 },
}).array('file', MAX_UPLOAD_FILES);

export function webRoutes({ db, engine }: { db: Db; engine: EngineJobs }): Router {
  const router = Router();
  const webs = new WebService(db);
  const versionOf = (request: Request) => parseInput(versionAddress, request.params, 'address');
  // One reader thread, started on demand and stopped when idle; a few uploads may wait for it (then 503).
  const uploadReader = createWorkerPool<UploadTask, WebRead>(new URL('./upload-worker.ts', import.meta.url), { threads: 1, maxQueue: 4, keepAlive: false });

  router.get('/', requireAction('webs.read-published'), async (request, response) => {
    const query = parseInput(webListQuerySchema, request.query, 'query');
    response.json(await webs.list(currentUser(response), query));
  });

  router.post('/', requireAction('webs.create'), async (request, response) => {
    const details = parseInput(webDetailsSchema, request.query, 'query');
    const web = checkedWeb(request.body);
    response.status(201).json(await webs.create(currentUser(response), { web, ...details }));
  });

  router.post('/upload', requireAction('webs.create'), upload, async (request, response) => {
    const fields = parseInput(uploadFieldsSchema, request.body, 'form');
    const files = (request.files as Express.Multer.File[] | undefined) ?? [];
    const read = await uploadReader.run({ files: files.map((f) => ({ name: f.originalname, data: f.buffer })), fields }, clientSignal(request, response));
    if (!read.web) throw new RequestError(422, 'The upload has problems: nothing was stored', read.problems);
    const created = await webs.create(currentUser(response), { web: checkedWeb(read.web), name: fields.name, place: read.place, period: read.period, note: fields.note });
    response.status(201).json({ ...created, warnings: read.warnings });
  });

  router.post('/balance', requireAction('webs.edit'), async (request, response) => {
    const body = parseInput(balancePreviewBodySchema, request.body);
    const web = checkedWeb(body.web, 'web.');
    const balanced = JSON.parse((await engine.balanceOffThread(web, body.method, { signal: clientSignal(request, response) })).toString('utf8'));
    response.json(balancePreview(web, balanced));
  });

  router.get('/:id', requireAction('webs.read-published'), async (request, response) => {
    const { id } = parseInput(webAddress, request.params, 'address');
    response.json(await webs.detail(currentUser(response), id));
  });

  router.post('/:id/versions', requireAction('webs.edit'), async (request, response) => {
    const { id } = parseInput(webAddress, request.params, 'address');
    const body = parseInput(newVersionBodySchema, request.body);
    const created = await webs.newVersion(currentUser(response), id, { web: checkedWeb(body.web, 'web.'), note: body.note ?? '', basedOn: body.basedOn ?? null });
    response.status(201).json(created);
  });

  // stakeholders read the baseline of an option shared for public comment (webs/visibility.ts), and no other web route
  router.get('/:id/versions/:versionId', requireAnyAction('webs.read-published', 'options.read-public'), async (request, response) => {
    const { id, versionId } = versionOf(request);
    response.json(await webs.version(currentUser(response), id, versionId));
  });

  router.post('/:id/versions/:versionId/publish', requireAction('webs.publish'), async (request, response) => {
    const { id, versionId } = versionOf(request);
    response.json(await webs.publish(currentUser(response), id, versionId));
  });

  router.post('/:id/versions/:versionId/clone', requireAction('webs.create'), async (request, response) => {
    const { id, versionId } = versionOf(request);
    const body = parseInput(cloneBodySchema, request.body);
    response.status(201).json(await webs.clone(currentUser(response), id, versionId, body));
  });

  router.get('/:id/versions/:versionId/export', requireAction('webs.read-published'), async (request, response) => {
    const { id, versionId } = versionOf(request);
    const { format } = parseInput(exportQuery, request.query, 'query');
    const version = await webs.versionForExport(currentUser(response), id, versionId);
    const file = await exportFile(version.web, version, version.number, format);
    response.type(file.contentType).attachment(file.fileName).send(file.body);
  });

  router.get('/:id/versions/:versionId/analysis', requireAction('webs.read-published'), async (request, response) => {
    const { id, versionId } = versionOf(request);
    const user = currentUser(response);
    const tables = tableSelection(request);
    await webs.visibleVersion(user, id, versionId);
    response.json(await versionAnalysis(db, engine, versionId, tables, async () => (await webs.version(user, id, versionId)).web, clientSignal(request, response)));
  });

  return router;
}
