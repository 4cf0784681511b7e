import { Router } from 'express';
import { readFile } from 'node:fs/promises';
import { analyze, createNetwork, parseWeb } from '@seinework/network-analysis';

/** The invented demo baseline (seeds/), analysed once at start-up and served read-only. */
export async function demoRoutes(demoWebPath: string): Promise<Router> {
  const web = parseWeb(JSON.parse(await readFile(demoWebPath, 'utf8')));
  const baseline = {
    name: web.name,
    unit: web.unit,
    compartments: web.compartments.map(({ id, name, kind }) => ({ id, name, kind })),
    analysis: analyze(createNetwork(web)),
  };
  const router = Router();
  router.get('/baseline', (_request, response) => {
    response.json(baseline);
  });
  return router;
}
