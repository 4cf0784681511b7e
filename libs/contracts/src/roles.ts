import { z } from 'zod';
import { ROLES } from './permissions';

/** The role × action table lives in permissions.ts (no zod); this adds the schema that validates a role. */
export * from './permissions';

export const roleSchema = z.enum(ROLES, { error: `role must be one of ${ROLES.join(', ')}` });
