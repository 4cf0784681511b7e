import type { Express } from 'express';
import { ACTIONS, ROLES, can, type Action, type Role } from '@seinework/contracts';
import { createTestApp, type TestAgent, type TestApp } from '../testing/test-app';

/**
 * The role × route matrix, walked exhaustively: every route the app registers must have a row
 * here, and every row is tried signed out (401 unless public) and as each of the five roles
 * (403 when the role may not take the row's action, anything but 401/403 when it may).
 *
 * OTHER SLICES: when you add a route, add its row below (method, path exactly as registered under
 * /api, and `access`: an Action of libs/contracts/src/roles.ts, a list of Actions any one of which
 * lets a role through, 'signed-in' for any signed-in person, or 'public'). The last test fails until
 * every registered route has its row.
 * Requests carry an empty JSON body and made-up ids: a permitted role then gets a 400 or 404
 * without changing anything, which is enough to show it was let through.
 */
type Access = Action | readonly Action[] | 'signed-in' | 'public';
interface RouteRow {
  readonly method: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  readonly path: string;
  readonly access: Access;
}

/** Options are read by those who read every option and by those who read shared ones. */
const OPTION_READERS: readonly Action[] = ['options.read-all', 'options.read-shared'];
/** One option, the run its share shows, its baseline and its discussion are also read by stakeholders (public comment). */
const SHARED_READERS: readonly Action[] = ['options.read-all', 'options.read-shared', 'options.read-public'];

const ROUTES: readonly RouteRow[] = [
  // stateless (no stored data): open to anyone, as before accounts existed
  { method: 'GET', path: '/api/health', access: 'public' },
  { method: 'GET', path: '/api/demo/baseline', access: 'public' },
  { method: 'POST', path: '/api/analyses', access: 'public' },
  { method: 'POST', path: '/api/balancing', access: 'public' },
  { method: 'POST', path: '/api/options/run', access: 'public' },
  { method: 'POST', path: '/api/options/sensitivity', access: 'public' },
  // sign-in and the session (db-auth)
  { method: 'POST', path: '/api/auth/sign-in', access: 'public' },
  { method: 'POST', path: '/api/auth/sign-out', access: 'public' },
  { method: 'GET', path: '/api/me', access: 'signed-in' },
  { method: 'POST', path: '/api/auth/change-password', access: 'signed-in' },
  // user administration and the audit log (db-auth)
  { method: 'GET', path: '/api/admin/users', access: 'users.manage' },
  { method: 'PATCH', path: '/api/admin/users/:id', access: 'users.manage' },
  { method: 'GET', path: '/api/admin/audit', access: 'audit.read' },
  // invitations, password resets and the outbox (mail)
  { method: 'POST', path: '/api/admin/invitations', access: 'users.manage' },
  { method: 'GET', path: '/api/admin/invitations', access: 'users.manage' },
  { method: 'DELETE', path: '/api/admin/invitations/:id', access: 'users.manage' },
  { method: 'GET', path: '/api/admin/outbox', access: 'outbox.read' },
  { method: 'GET', path: '/api/auth/invitations/:token', access: 'public' },
  { method: 'POST', path: '/api/auth/invitations/:token/accept', access: 'public' },
  { method: 'POST', path: '/api/auth/password-reset', access: 'public' },
  { method: 'POST', path: '/api/auth/password-reset/:token', access: 'public' },
  // stored webs and their versions (webs-server)
  { method: 'GET', path: '/api/webs', access: 'webs.read-published' },
  { method: 'POST', path: '/api/webs', access: 'webs.create' },
  { method: 'POST', path: '/api/webs/upload', access: 'webs.create' },
  { method: 'POST', path: '/api/webs/balance', access: 'webs.edit' },
  { method: 'GET', path: '/api/webs/:id', access: 'webs.read-published' },
  { method: 'POST', path: '/api/webs/:id/versions', access: 'webs.edit' },
  { method: 'GET', path: '/api/webs/:id/versions/:versionId', access: ['webs.read-published', 'options.read-public'] },
  { method: 'POST', path: '/api/webs/:id/versions/:versionId/publish', access: 'webs.publish' },
  { method: 'POST', path: '/api/webs/:id/versions/:versionId/clone', access: 'webs.create' },
  { method: 'GET', path: '/api/webs/:id/versions/:versionId/export', access: 'webs.read-published' },
  { method: 'GET', path: '/api/webs/:id/versions/:versionId/analysis', access: 'webs.read-published' },
  // stored harvest options, council shares, preferences and comparisons (options-server)
  { method: 'POST', path: '/api/webs/:id/versions/:versionId/options', access: 'options.edit' },
  { method: 'GET', path: '/api/webs/:id/versions/:versionId/options', access: OPTION_READERS },
  { method: 'POST', path: '/api/webs/:id/versions/:versionId/options/preview', access: 'options.edit' },
  { method: 'GET', path: '/api/options/:id', access: SHARED_READERS },
  { method: 'PUT', path: '/api/options/:id', access: 'options.edit' },
  { method: 'POST', path: '/api/options/:id/duplicate', access: 'options.edit' },
  { method: 'DELETE', path: '/api/options/:id', access: 'options.edit' },
  { method: 'POST', path: '/api/options/:id/shares', access: 'options.share' },
  { method: 'DELETE', path: '/api/shares/:id', access: 'options.share' },
  { method: 'POST', path: '/api/options/:id/preferences', access: 'preferences.record' },
  { method: 'GET', path: '/api/options/:id/preferences', access: OPTION_READERS },
  { method: 'GET', path: '/api/comparisons', access: OPTION_READERS },
  // runs and their queue (runs-queue)
  { method: 'POST', path: '/api/options/:id/runs', access: 'options.edit' },
  { method: 'GET', path: '/api/options/:id/runs', access: OPTION_READERS },
  { method: 'GET', path: '/api/runs/:id', access: SHARED_READERS },
  { method: 'POST', path: '/api/runs/:id/cancel', access: 'options.edit' },
  { method: 'GET', path: '/api/runs/:id/events', access: OPTION_READERS },
  // public comment and discussion, notices (discussion)
  { method: 'GET', path: '/api/options/:id/comments', access: SHARED_READERS },
  { method: 'POST', path: '/api/options/:id/comments', access: 'comments.post' },
  { method: 'PATCH', path: '/api/comments/:id', access: 'comments.post' },
  { method: 'POST', path: '/api/comments/:id/hide', access: 'comments.moderate' },
  { method: 'PUT', path: '/api/options/:id/follow', access: SHARED_READERS },
  { method: 'DELETE', path: '/api/options/:id/follow', access: SHARED_READERS },
  { method: 'GET', path: '/api/discussions', access: SHARED_READERS },
  { method: 'GET', path: '/api/me/notifications', access: 'signed-in' },
  { method: 'PUT', path: '/api/me/notifications', access: 'signed-in' },
  { method: 'GET', path: '/api/notifications/unsubscribe', access: 'public' },
  { method: 'POST', path: '/api/notifications/unsubscribe', access: 'public' },
  // briefs of options and comparisons (briefs)
  { method: 'GET', path: '/api/options/:id/brief', access: 'briefs.read' },
  { method: 'GET', path: '/api/options/:id/brief.pdf', access: 'briefs.read' },
  { method: 'GET', path: '/api/comparisons/brief', access: 'briefs.read' },
  { method: 'GET', path: '/api/comparisons/brief.pdf', access: 'briefs.read' },
];

/** Every route of the app as `METHOD /path`, read from Express's router (mounted routers included). */
function registeredRoutes(app: Express): string[] {
  interface Layer {
    rawPath?: string;
    route?: { path: string; methods: Record<string, boolean> };
    handle: { stack?: Layer[] };
  }
  const found: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const [method, on] of Object.entries(layer.route.methods)) if (on && method !== '_all') found.push(`${method.toUpperCase()} ${join(prefix, layer.route.path)}`);
      } else if (layer.handle.stack) {
        walk(layer.handle.stack, join(prefix, typeof layer.rawPath === 'string' ? layer.rawPath : ''));
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return [...new Set(found)].sort();
}

function join(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function send(agent: TestAgent, row: RouteRow) {
  const path = row.path.replace(/:(\w+)/g, (_m, name: string) => `no-such-${name}`);
  const request = agent[row.method.toLowerCase() as 'get' | 'post' | 'patch' | 'put' | 'delete'](path);
  return row.method === 'GET' ? request : request.send({});
}

const allowed = (role: Role, access: Access) =>
  access === 'public' || access === 'signed-in' || (typeof access === 'string' ? can(role, access) : access.some((action) => can(role, action)));

let t: TestApp;
const agents = new Map<Role, TestAgent>();
beforeAll(async () => {
  t = await createTestApp();
  for (const role of ROLES) agents.set(role, await t.signInAs(role));
}, 60_000);
afterAll(() => t.close());

describe('role × route matrix', () => {
  describe.each(ROUTES)('$method $path ($access)', (row) => {
    it(row.access === 'public' ? 'is open signed out' : 'answers 401 signed out', async () => {
      const response = await send(t.anonymous(), row);
      if (row.access === 'public') expect([401, 403]).not.toContain(response.status);
      else expect(response.status).toBe(401);
    });

    it.each(ROLES.filter(() => row.access !== 'public'))('as %s: let through or 403 as the role table says', async (role) => {
      const response = await send(agents.get(role)!, row);
      if (allowed(role, row.access)) expect([401, 403], JSON.stringify(response.body)).not.toContain(response.status);
      else {
        expect(response.status).toBe(403);
        for (const action of typeof row.access === 'string' ? [row.access] : row.access) expect(response.body.error).toContain(action);
      }
    });
  });

  it('has a row for every route the app registers, and no row for a route that does not exist', () => {
    const registered = registeredRoutes(t.app);
    const rows = ROUTES.map((row) => `${row.method} ${row.path}`).sort();
    expect(rows).toEqual(registered);
  });

  it('names only actions of the role table', () => {
    for (const row of ROUTES) for (const access of typeof row.access === 'string' ? [row.access] : row.access) expect(['public', 'signed-in', ...ACTIONS]).toContain(access);
  });
});
