import { Router, type Response } from 'express';
import { z } from 'zod';
import { comparisonQuerySchema } from '@seinework/contracts';
import { currentUser } from '../auth/guards';
import type { Db } from '../db/database';
import type { EngineJobs } from '../engine/engine-jobs';
import { requireAnyAction } from '../options/read-guard';
import { parseInput } from '../validate';
import { BriefService } from './brief-service';
import { comparisonBriefPdf } from './pdf/comparison-brief-pdf';
import { optionBriefPdf } from './pdf/option-brief-pdf';

/**
 * Briefs of an option's run and of a comparison, mounted under /api: as JSON for the print page and
 * as PDF to download. Readers need briefs.read; which options they see, the option services decide.
 */

const id = z.string().min(1).max(64);
const optionAddress = z.strictObject({ id });
const optionQuery = z.strictObject({ run: id.optional() });

const readsBriefs = requireAnyAction('briefs.read');

/** A file name of letters, digits and hyphens only, whatever the option is called. */
export function safeFileName(name: string, suffix: string): string {
  const stem = name
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .toLowerCase();
  return `${stem || 'brief'}-${suffix.replace(/[^A-Za-z0-9]/g, '').slice(0, 8)}.pdf`;
}

function sendPdf(response: Response, pdf: Buffer, fileName: string): void {
  response.setHeader('Content-Type', 'application/pdf');
  response.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
  response.setHeader('Cache-Control', 'private, no-store');
  response.setHeader('Content-Length', String(pdf.length));
  response.end(pdf);
}

export function briefRoutes({ db, engine }: { db: Db; engine: EngineJobs }): Router {
  const router = Router();
  const service = new BriefService(db, engine);

  router.get('/options/:id/brief', readsBriefs, async (request, response) => {
    const { id: optionId } = parseInput(optionAddress, request.params, 'address');
    const { run } = parseInput(optionQuery, request.query, 'query');
    response.json(await service.optionBrief(currentUser(response), optionId, run));
  });

  router.get('/options/:id/brief.pdf', readsBriefs, async (request, response) => {
    const { id: optionId } = parseInput(optionAddress, request.params, 'address');
    const { run } = parseInput(optionQuery, request.query, 'query');
    const brief = await service.optionBrief(currentUser(response), optionId, run);
    sendPdf(response, await optionBriefPdf(brief), safeFileName(`brief ${brief.option.name}`, brief.run.id));
  });

  router.get('/comparisons/brief', readsBriefs, async (request, response) => {
    const { runs } = parseInput(comparisonQuerySchema, request.query, 'query');
    response.json(await service.comparisonBrief(currentUser(response), runs));
  });

  router.get('/comparisons/brief.pdf', readsBriefs, async (request, response) => {
    const { runs } = parseInput(comparisonQuerySchema, request.query, 'query');
    const brief = await service.comparisonBrief(currentUser(response), runs);
    sendPdf(response, await comparisonBriefPdf(brief), safeFileName(`comparison ${brief.web.name}`, brief.options[0]!.runId));
  });

  return router;
}
