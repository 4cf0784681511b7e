/**
 * The five roles of PRODUCT.md and what each may do: the one table the server enforces on every
 * route and the browser reads to hide what a role may not do. Later slices add their actions here.
 * Free of zod on purpose: the browser app loads this table at start (through
 * `@seinework/contracts/permissions`) without loading the whole schema library with it.
 */

export const ROLES = ['admin', 'analyst', 'council', 'stakeholder', 'staff'] as const;
export type Role = (typeof ROLES)[number];

export const ACTIONS = [
  /** Read published web versions (baselines). */
  'webs.read-published',
  /** Read draft versions too (nobody sees a draft that was not shared with them). */
  'webs.read-drafts',
  /** Create a web from WEB.json or an upload, or clone a version into a new web. */
  'webs.create',
  /** Save draft versions, clone a published version into a new draft, balance a draft. */
  'webs.edit',
  /** Publish a draft version (it becomes immutable). */
  'webs.publish',
  /** List users, invite, change roles, deactivate. */
  'users.manage',
  /** Read the audit log. */
  'audit.read',
  /** Read the outbox of sent e-mail. */
  'outbox.read',
  /** Read every harvest option and run. */
  'options.read-all',
  /** Create, edit, duplicate and delete harvest options; start and cancel runs. */
  'options.edit',
  /** Share an option for council review (and later public comment); withdraw a share. */
  'options.share',
  /** Read options shared for council review, their runs and the baselines they stand on; compare them. */
  'options.read-shared',
  /**
   * Read an option shared for public comment, the run its public share shows and the baseline it
   * stands on (stakeholders; those who read shared options see public shares too).
   */
  'options.read-public',
  /** Record a preference among compared options (on an option shared with the member). */
  'preferences.record',
  /** Comment on an option one may read (stakeholders: only while it is open for public comment). */
  'comments.post',
  /** Hide a comment with a reason (moderation). */
  'comments.moderate',
  /** Print and download briefs of options and comparisons. */
  'briefs.read',
] as const;
export type Action = (typeof ACTIONS)[number];

const PERMISSIONS: Readonly<Record<Role, readonly Action[]>> = {
  admin: ACTIONS,
  analyst: ['webs.read-published', 'webs.read-drafts', 'webs.create', 'webs.edit', 'webs.publish', 'options.read-all', 'options.edit', 'options.share', 'comments.post', 'briefs.read'],
  council: ['webs.read-published', 'options.read-shared', 'preferences.record', 'comments.post'],
  staff: ['webs.read-published', 'options.read-shared', 'comments.post', 'comments.moderate', 'briefs.read'],
  stakeholder: ['options.read-public', 'comments.post'],
};

/** Whether a role may take an action: the single rule behind every server check and every hidden button. */
export function can(role: Role, action: Action): boolean {
  return PERMISSIONS[role].includes(action);
}

/** Every action a role may take, for the browser's session state. */
export function actionsOf(role: Role): Action[] {
  return [...PERMISSIONS[role]];
}
