import { ROLES, type Role } from '@seinework/contracts';

/** One demo account per role, printed in the README; never created, and refused at sign-in, in production. */
export const DEMO_PASSWORD = 'seinework-demo';
export const DEMO_EMAIL_DOMAIN = '@demo.test';

const NAMES: Record<Role, string> = {
  admin: 'Ada Demo (data manager)',
  analyst: 'Ana Demo (analyst)',
  council: 'Cole Demo (council member)',
  stakeholder: 'Sten Demo (stakeholder)',
  staff: 'Stef Demo (staff)',
};

export interface DemoUser {
  readonly email: string;
  readonly name: string;
  readonly role: Role;
}

export const DEMO_USERS: readonly DemoUser[] = ROLES.map((role) => ({ email: demoEmail(role), name: NAMES[role], role }));

export function demoEmail(role: Role): string {
  return `${role}${DEMO_EMAIL_DOMAIN}`;
}

export function isDemoEmail(email: string): boolean {
  return email.toLowerCase().endsWith(DEMO_EMAIL_DOMAIN);
}
