import { ChangeDetectionStrategy, Component, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

/** Staff hide a comment with a reason: the author and staff see the reason, the audit log keeps it. */
@Component({
  selector: 'sw-hide-dialog',
  imports: [FormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>Hide this comment</h2>
    <mat-dialog-content>
      <p>Others will see that a comment was hidden, not what it said. Its author and staff still see it, with your reason.</p>
      <mat-form-field appearance="outline" subscriptSizing="dynamic" class="reason">
        <mat-label>Reason for hiding</mat-label>
        <textarea matInput rows="3" name="reason" maxlength="500" [ngModel]="reason()" (ngModelChange)="reason.set($event)" required></textarea>
      </mat-form-field>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Keep it shown</button>
      <button mat-flat-button type="button" [disabled]="reason().trim().length === 0" [mat-dialog-close]="reason().trim()">Hide comment</button>
    </mat-dialog-actions>
  `,
  styles: `
    .reason {
      width: 100%;
    }
  `,
})
export class HideDialog {
  protected readonly reason = signal('');
}
