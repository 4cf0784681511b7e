import { Pipe, type PipeTransform } from '@angular/core';
import type { Role } from '@seinework/contracts';

/** Each role as the interface names it (PRODUCT.md's roles, in words a council member recognises). */
export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  admin: 'Administrator',
  analyst: 'Analyst',
  council: 'Council member',
  stakeholder: 'Stakeholder',
  staff: 'Staff',
};

@Pipe({ name: 'roleLabel' })
export class RoleLabelPipe implements PipeTransform {
  transform(role: Role): string {
    return ROLE_LABELS[role] ?? role;
  }
}
