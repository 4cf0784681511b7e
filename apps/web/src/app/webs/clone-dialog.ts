import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

export interface CloneDetails {
  name: string;
  place: string;
  period: string;
}

/** Asks for the new web's name, place and period before a version is cloned into it. */
@Component({
  selector: 'sw-clone-dialog',
  imports: [FormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>Clone into a new web</h2>
    <form (ngSubmit)="cloneWeb()" #form="ngForm">
      <mat-dialog-content>
        <p>The new web starts with a draft that copies version {{ data.versionNumber }} of “{{ data.webName }}”. The original is not changed.</p>
        <mat-form-field appearance="outline">
          <mat-label>Name of the new web</mat-label>
          <input matInput name="name" required maxlength="200" [ngModel]="name()" (ngModelChange)="name.set($event)" cdkFocusInitial />
          @if (form.submitted && !name().trim()) {
            <mat-error>Give the new web a name.</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Place</mat-label>
          <input matInput name="place" maxlength="200" [ngModel]="place()" (ngModelChange)="place.set($event)" />
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Period</mat-label>
          <input matInput name="period" maxlength="100" [ngModel]="period()" (ngModelChange)="period.set($event)" />
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit">Clone</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `mat-form-field { display: block; width: 100%; } p { margin-top: 0; }`,
})
export class CloneDialog {
  protected readonly data = inject<{ webName: string; versionNumber: number; place: string; period: string }>(MAT_DIALOG_DATA);
  private readonly dialog = inject(MatDialogRef<CloneDialog, CloneDetails>);
  protected readonly name = signal(`${this.data.webName} (copy)`);
  protected readonly place = signal(this.data.place);
  protected readonly period = signal(this.data.period);

  protected cloneWeb(): void {
    if (!this.name().trim()) return;
    this.dialog.close({ name: this.name().trim(), place: this.place().trim(), period: this.period().trim() });
  }
}
