import type { CanDeactivateFn } from '@angular/router';

export interface HasUnsavedChanges {
  hasUnsavedChanges(): boolean;
}

/** Leaving a page with unsaved edits asks first: a save is a deliberate new version, never automatic. */
export const unsavedChangesGuard: CanDeactivateFn<HasUnsavedChanges> = (page) =>
  !page.hasUnsavedChanges() || window.confirm('You have changes that are not saved. Leave this page and lose them?');
