import type { AddressInfo } from 'node:net';
import { resolve } from 'node:path';
import { gzipSync } from 'node:zlib';
import type { Express } from 'express';
import request from 'supertest';
import { API_LIMITS } from '@seinework/contracts';
import cone from '../../../../tests/fixtures/cone-spring.json';
import { createApp } from '../app';
import { createEngineJobs, type EngineJobs } from '../engine/engine-jobs';

/** Careless and hostile requests (issue 6): each gets a clear 4xx before any engine work. */

const demoWebPath = resolve(import.meta.dirname, '../../../../seeds/brannock-bay.json');
let engine: EngineJobs;
let app: Express;

beforeAll(async () => {
  engine = createEngineJobs({ threads: 1, keepAlive: true });
  app = await createApp({ demoWebPath, engine });
});
afterAll(() => engine.destroy());

const postJson = (path: string, text: string) => request(app).post(path).set('Content-Type', 'application/json').send(text);

describe('request bodies', () => {
  it('refuses a body that says it is gzip but is not (400, not 500)', async () => {
    const response = await postJson('/api/analyses', JSON.stringify(cone)).set('Content-Encoding', 'gzip');
    expect(response.status).toBe(400);
    expect(response.body.error).toBe('The request body is not valid gzip data (Content-Encoding: gzip)');
  });

  it('reads a body that really is gzip, and refuses an encoding it does not read with 415', async () => {
    // sent with fetch: supertest would serialise a Buffer as JSON
    const server = app.listen(0, '127.0.0.1');
    await new Promise((ready) => server.once('listening', ready));
    try {
      const { port } = server.address() as AddressInfo;
      const zipped = await fetch(`http://127.0.0.1:${port}/api/analyses`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'content-encoding': 'gzip' },
        body: gzipSync(JSON.stringify(cone)),
      });
      expect(zipped.status).toBe(200);
      expect((await zipped.json()).tst).toBeCloseTo(42445, 6);
    } finally {
      await new Promise((done) => server.close(done));
    }
    const unknown = await postJson('/api/analyses', JSON.stringify(cone)).set('Content-Encoding', 'compress');
    expect(unknown.status).toBe(415);
    expect(unknown.body.error).toMatch(/Content-Encoding "compress"/);
  });

  it('answers 415 to a body that is not JSON by its type, whatever it holds', async () => {
    for (const type of ['text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x']) {
      const response = await request(app).post('/api/analyses').set('Content-Type', type).send(JSON.stringify(cone));
      expect(response.status, type).toBe(415);
      expect(response.body.error).toMatch(/application\/json/);
    }
  });

  it('says a JSON body that is null, an array or a number is not an object', async () => {
    for (const [text, what] of [['null', 'null'], ['[1,2]', 'an array'], ['42', 'a number'], ['"web"', 'a string']]) {
      const response = await postJson('/api/analyses', text);
      expect(response.status, text).toBe(400);
      expect(response.body.error).toBe(`The request body is not an object: it is ${what}`);
    }
    const empty = await request(app).post('/api/options/run').set('Content-Type', 'application/json');
    expect(empty.status).toBe(400);
    expect(empty.body.error).toMatch(/no body/);
  });

  it('refuses a key given twice, naming it and where it is', async () => {
    const text = JSON.stringify({ ...cone, flows: cone.flows.slice(0, 2) }).replace('"value":', '"value":999,"value":');
    const response = await postJson('/api/analyses', text);
    expect(response.status).toBe(400);
    expect(response.body).toEqual({ error: 'The request body gives a key twice', details: ['flows[0]: duplicate key "value"'] });
    const wrapped = await postJson('/api/options/run', `{"web":${JSON.stringify(cone)},"option":{"name":"a","name":"b","adjustments":[]}}`);
    expect(wrapped.body.details).toEqual(['option: duplicate key "name"']);
  });

  it('answers 413 naming the limit to a body over 5 MB', async () => {
    const response = await postJson('/api/analyses', JSON.stringify({ ...cone, name: 'x'.repeat(6 * 1024 * 1024) }));
    expect(response.status).toBe(413);
    expect(response.body.error).toMatch(/larger than 5 MB/);
  });

  it('reads the bodies of every other route the same way (before any route sees them)', async () => {
    const elsewhere = (text: string) => request(app).post('/api/elsewhere').set('Content-Type', 'application/json').send(text);
    expect((await elsewhere('{"a":1,"a":2}')).body).toEqual({ error: 'The request body gives a key twice', details: ['duplicate key "a"'] });
    expect((await elsewhere('{"a":').set('Content-Encoding', 'gzip')).status).toBe(400);
    expect((await request(app).post('/api/elsewhere').set('Content-Type', 'text/csv').send('a,b')).status).toBe(415);
    expect((await elsewhere('{"a":1}')).status).toBe(404);
  });

  it('answers 400 naming the problem for text that is not JSON', async () => {
    const response = await postJson('/api/analyses', '{"name": ');
    expect(response.status).toBe(400);
    expect(response.body.error).toBe('The request body is not valid JSON');
    expect(response.body.details).toHaveLength(1);
  });
});

describe('refusals', () => {
  it('lists the first 20 problems and counts the rest', async () => {
    const flows = Array.from({ length: 35 }, (_, i) => ({ from: 'plants', to: `nowhere-${i}`, value: 1 }));
    const response = await postJson('/api/analyses', JSON.stringify({ ...cone, flows }));
    expect(response.status).toBe(422);
    expect(response.body.details).toHaveLength(21);
    expect(response.body.details.at(-1)).toBe('…and 15 more problems');
  });

  it('says the harvest option, not the web, is what is wrong', async () => {
    const invalid = await postJson('/api/options/run', JSON.stringify({ web: cone, option: { name: 'x', adjustments: [{ type: 'scale-catch' }] } }));
    expect(invalid.status).toBe(422);
    expect(invalid.body.error).toBe('The harvest option is not valid');
    expect(invalid.body.details[0]).toMatch(/^option: adjustments\[0\]/);
    const unknownFleet = await postJson('/api/options/run', JSON.stringify({ web: cone, option: { name: 'x', adjustments: [{ type: 'close-fleet', fleet: 'nobody' }] } }));
    expect(unknownFleet.status).toBe(422);
    expect(unknownFleet.body.error).toMatch(/^The harvest option /);
    const badWeb = await postJson('/api/options/run', JSON.stringify({ web: { ...cone, unit: 3 }, option: { name: 'x', adjustments: [] } }));
    expect(badWeb.body.error).toBe('The web is not valid');
  });

  it('names the whole path of an unknown API route', async () => {
    const response = await request(app).post('/api/options/nothing-here?x=1').set('Content-Type', 'application/json').send('{}');
    expect(response.status).toBe(404);
    expect(response.body.error).toBe('No such API route: POST /api/options/nothing-here');
  });

  it('refuses a web over the API limits with 413 naming each limit, before any work', async () => {
    const compartments = Array.from({ length: API_LIMITS.compartments + 1 }, (_, i) => ({ id: `c${i}`, name: `C${i}`, kind: 'consumer' }));
    const flows = Array.from({ length: API_LIMITS.flows + 1 }, () => ({ from: 'c0', to: 'c1', value: 1 }));
    const response = await postJson('/api/analyses', JSON.stringify({ ...cone, compartments, flows }));
    expect(response.status).toBe(413);
    expect(response.body.details).toEqual([
      `compartments: ${API_LIMITS.compartments + 1} given, at most 400 per web`,
      `flows: ${API_LIMITS.flows + 1} given, at most 20,000 per web`,
    ]);
    const run = await postJson('/api/options/run', JSON.stringify({ web: { ...cone, compartments }, option: { name: 'x', adjustments: [] } }));
    expect(run.status).toBe(413);
    expect(run.body.details).toEqual([`web.compartments: ${API_LIMITS.compartments + 1} given, at most 400 per web`]);
    const adjustments = Array.from({ length: API_LIMITS.adjustments + 1 }, () => ({ type: 'close-fleet', fleet: 'x' }));
    const option = await postJson('/api/options/run', JSON.stringify({ web: cone, option: { name: 'x', adjustments } }));
    expect(option.status).toBe(413);
    expect(option.body.details[0]).toMatch(/at most 1,000 per option/);
  });

  it('refuses a table selection it does not know', async () => {
    const response = await postJson('/api/analyses?tables=some', JSON.stringify(cone));
    expect(response.status).toBe(400);
    expect(response.body.error).toMatch(/tables must be/);
  });
});

describe('origin check', () => {
  const analysis = () => request(app).post('/api/analyses').set('Content-Type', 'application/json');

  it('refuses a DNS-rebinding page: a foreign Origin with a matching Host header', async () => {
    const response = await analysis().set('Origin', 'http://evil.example').set('Host', 'evil.example').send(JSON.stringify(cone));
    expect(response.status).toBe(403);
    expect(response.body.error).toBe('Requests from http://evil.example are not accepted');
  });

  it('refuses a foreign origin before reading the body, whatever it holds', async () => {
    for (const body of ['{"name": ', 'x'.repeat(6 * 1024 * 1024)]) {
      const response = await analysis().set('Origin', 'https://elsewhere.example').send(body);
      expect(response.status).toBe(403);
    }
    const zipped = await analysis().set('Origin', 'https://elsewhere.example').set('Content-Encoding', 'gzip').send('not gzip');
    expect(zipped.status).toBe(403);
  });

  it('without a configured origin, accepts the address it listens on (and its loopback names); refuses a Referer from elsewhere', async () => {
    const server = app.listen(0, '127.0.0.1');
    await new Promise((ready) => server.once('listening', ready));
    try {
      const { port } = server.address() as AddressInfo;
      for (const origin of [`http://127.0.0.1:${port}`, `http://localhost:${port}`]) {
        const response = await request(server).post('/api/analyses').set('Content-Type', 'application/json').set('Origin', origin).send(JSON.stringify(cone));
        expect(response.status, origin).toBe(200);
      }
      const otherPort = await request(server).post('/api/analyses').set('Content-Type', 'application/json').set('Origin', `http://127.0.0.1:${port + 1}`).send('{}');
      expect(otherPort.status).toBe(403);
    } finally {
      await new Promise((done) => server.close(done));
    }
    const referer = await analysis().set('Referer', 'http://evil.example/page').send(JSON.stringify(cone));
    expect(referer.status).toBe(403);
  });

  it('asks a request that carries a cookie to say where it comes from; without cookie or Origin (CLI, scripts) it passes', async () => {
    const cookie = await analysis().set('Cookie', 'seinework_session=abc').send(JSON.stringify(cone));
    expect(cookie.status).toBe(403);
    expect(cookie.body.error).toMatch(/cookie must say where it comes from/);
    const script = await analysis().send(JSON.stringify(cone));
    expect(script.status).toBe(200);
  });

  it('with a configured public origin, accepts exactly it (and loopback aliases of a loopback origin)', async () => {
    const configured = await createApp({ demoWebPath, engine, publicOrigin: 'http://127.0.0.1:4300' });
    const from = (origin: string) => request(configured).post('/api/analyses').set('Content-Type', 'application/json').set('Origin', origin).set('Cookie', 'a=b').send(JSON.stringify(cone));
    expect((await from('http://127.0.0.1:4300')).status).toBe(200);
    expect((await from('http://localhost:4300')).status).toBe(200);
    expect((await from('http://localhost:4301')).status).toBe(403);
    expect((await from('https://127.0.0.1:4300')).status).toBe(403);
    expect((await from('null')).status).toBe(403);
    const published = await createApp({ demoWebPath, engine, publicOrigin: 'https://seinework.example.org' });
    const rebinding = await request(published).post('/api/analyses').set('Content-Type', 'application/json').set('Origin', 'http://evil.example').set('Host', 'evil.example').send(JSON.stringify(cone));
    expect(rebinding.status).toBe(403);
    const own = await request(published).post('/api/analyses').set('Content-Type', 'application/json').set('Origin', 'https://seinework.example.org').send(JSON.stringify(cone));
    expect(own.status).toBe(200);
  });
});
