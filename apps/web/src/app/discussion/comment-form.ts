import { ChangeDetectionStrategy, Component, computed, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MAX_COMMENT_LENGTH, type CommentAnchor } from '@seinework/contracts';
import { anchorToken, parseAnchorToken, type AnchorChoice } from './anchor-choices';

/** What the form gives its page: the text and, when chosen, what the comment points at. */
export interface CommentDraft {
  text: string;
  anchor?: CommentAnchor;
}

function codePoints(text: string): number {
  let count = 0;
  for (const _ of text) count++;
  return count;
}

/**
 * A comment, reply or edit: plain text with a live count against the limit, and (for a new
 * comment) an optional pick of the indicator or compartment it is about.
 */
@Component({
  selector: 'sw-comment-form',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <form (ngSubmit)="submit()" class="comment-form">
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>{{ label() }}</mat-label>
        <textarea matInput name="text" rows="4" [ngModel]="text()" (ngModelChange)="text.set($event)" [maxlength]="limit * 2" dir="auto"></textarea>
        <mat-hint align="end" [class.over]="tooLong()">{{ length() }} / {{ limit }}</mat-hint>
        <mat-hint>Plain text; web addresses become links.</mat-hint>
      </mat-form-field>
      @if (choices().length > 0) {
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>About (optional)</mat-label>
          <mat-select name="anchor" [ngModel]="anchor()" (ngModelChange)="anchor.set($event)">
            <mat-option value="">The option as a whole</mat-option>
            @for (choice of choices(); track token(choice)) {
              <mat-option [value]="token(choice)">{{ choice.label }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
      }
      @if (tooLong()) {
        <p class="problem" role="alert">A comment may be at most {{ limit }} characters; this one has {{ length() }}.</p>
      }
      <div class="actions">
        <button mat-flat-button type="submit" [disabled]="busy() || empty() || tooLong()">{{ submitLabel() }}</button>
        @if (cancellable()) {
          <button mat-button type="button" (click)="cancelled.emit()">Cancel</button>
        }
      </div>
    </form>
  `,
  styles: `
    .comment-form {
      display: grid;
      gap: 12px;
      max-width: 72ch;
    }
    .actions {
      display: flex;
      gap: 8px;
    }
    .over,
    .problem {
      color: var(--mat-sys-error);
    }
    .problem {
      margin: 0;
    }
  `,
})
export class CommentForm {
  readonly label = input('Your comment');
  readonly submitLabel = input('Post comment');
  readonly choices = input<AnchorChoice[]>([]);
  /** The text to start from (an edit), and the anchor to start from (`indicator:tst`). */
  readonly initialText = input('');
  readonly initialAnchor = input<string | null>(null);
  readonly busy = input(false);
  readonly cancellable = input(false);
  readonly submitted = output<CommentDraft>();
  readonly cancelled = output<void>();

  protected readonly limit = MAX_COMMENT_LENGTH;
  protected readonly text = signal('');
  protected readonly anchor = signal('');
  protected readonly length = computed(() => codePoints(this.text().trim()));
  protected readonly tooLong = computed(() => this.length() > this.limit);
  protected readonly empty = computed(() => this.text().trim().length === 0);
  protected readonly token = (choice: AnchorChoice) => anchorToken(choice.anchor);

  ngOnInit(): void {
    this.text.set(this.initialText());
    this.anchor.set(this.initialAnchor() ?? '');
  }

  /** Called by the page once the post went through. */
  clear(): void {
    this.text.set('');
    this.anchor.set('');
  }

  protected submit(): void {
    if (this.empty() || this.tooLong()) return;
    const anchor = parseAnchorToken(this.anchor());
    this.submitted.emit(anchor ? { text: this.text(), anchor } : { text: this.text() });
  }
}
