import { ChangeDetectionStrategy, Component, inject, output } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { OptionSummary } from '@seinework/contracts';
import { CompareStore, MAX_COMPARED, MIN_COMPARED } from './compare-store';

/** Choosing what to compare: a web, one of its published versions (the baseline), and 2–6 options with a finished run. */
@Component({
  selector: 'sw-run-picker',
  imports: [DatePipe, RouterLink, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatProgressBarModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p class="explain">
      Put two to six harvest options on one baseline side by side. Choose the web and its published version, then tick the
      options to compare.
    </p>
    @if (store.websLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the webs" />
    }
    @if (store.websError(); as error) {
      <p class="error" role="alert">{{ error }}</p>
    } @else if (!store.websLoading() && store.webs().length === 0) {
      <p class="empty">There is no published web yet, so there is nothing to compare.</p>
    } @else {
      <div class="fields">
        <mat-form-field appearance="outline">
          <mat-label>Web</mat-label>
          <mat-select [value]="store.webId()" (valueChange)="store.chooseWeb($event)">
            @for (web of store.webs(); track web.id) {
              <mat-option [value]="web.id">{{ web.name }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Baseline (published version)</mat-label>
          <mat-select [value]="store.versionId()" (valueChange)="store.chooseVersion($event)" [disabled]="store.publishedVersions().length === 0">
            @for (version of store.publishedVersions(); track version.id) {
              <mat-option [value]="version.id">Version {{ version.number }}{{ version.note ? ' — ' + version.note : '' }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
      </div>
    }

    @if (store.optionsLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the options" />
    }
    @if (store.pickError(); as error) {
      <p class="error" role="alert">{{ error }}</p>
    }
    @if (store.versionId() && !store.optionsLoading() && !store.pickError()) {
      @if (store.options().length === 0) {
        <p class="empty">There is no harvest option on this baseline that you may see yet.</p>
      } @else {
        <fieldset>
          <legend>Options on this baseline ({{ store.picked().length }} of {{ max }} ticked)</legend>
          <ul class="options">
            @for (option of store.options(); track option.id) {
              <li>
                @if (option.latestRun?.status === 'done') {
                  <mat-checkbox
                    [checked]="store.picked().includes(option.latestRun!.id)"
                    [disabled]="!store.picked().includes(option.latestRun!.id) && store.picked().length >= max"
                    (change)="store.togglePick(option.latestRun!.id)"
                  >
                    {{ option.name }}
                  </mat-checkbox>
                  <span class="facts">
                    run of {{ option.latestRun!.draws }} draws, finished {{ option.latestRun!.finishedAt | date: 'd MMM y, HH:mm' }} ·
                    <a [routerLink]="['/options', option.id]">about this option</a>
                  </span>
                } @else {
                  <mat-checkbox disabled>{{ option.name }}</mat-checkbox>
                  <span class="facts">{{ notReadyText(option) }} · <a [routerLink]="['/options', option.id]">about this option</a></span>
                }
                @if (option.purpose) {
                  <span class="purpose">{{ option.purpose }}</span>
                }
              </li>
            }
          </ul>
        </fieldset>
        @if (store.notReady() > 0) {
          <p class="quiet">
            Options without a finished run cannot be compared yet.
            <button mat-button type="button" (click)="store.chooseVersion(store.versionId()!)">Check again</button>
          </p>
        }
        <div class="actions">
          <button mat-flat-button type="button" [disabled]="!store.canCompare()" (click)="compareRuns.emit(store.picked())">Compare</button>
          @if (!store.canCompare()) {
            <span class="quiet" role="status">Tick at least {{ min }} options to compare.</span>
          }
        </div>
      }
    }
  `,
  styles: `
    .explain { max-width: 80ch; }
    .fields { display: flex; flex-wrap: wrap; gap: 0 16px; }
    .fields mat-form-field { width: min(100%, 420px); }
    fieldset { border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; padding: 8px 16px 12px; margin: 0 0 12px; max-width: 90ch; }
    legend { font: var(--mat-sys-title-small); padding: 0 4px; }
    .options { list-style: none; margin: 0; padding: 0; }
    .options li { padding: 8px 0; border-bottom: 1px solid var(--mat-sys-outline-variant); }
    .options li:last-child { border-bottom: 0; }
    .facts, .purpose { display: block; margin-left: 40px; font-size: 0.875rem; color: var(--mat-sys-on-surface-variant); }
    .purpose { color: var(--mat-sys-on-surface); }
    .actions { display: flex; align-items: center; gap: 16px; }
    .quiet { color: var(--mat-sys-on-surface-variant); }
    .error { color: var(--mat-sys-error); }
    a { color: var(--mat-sys-primary); }
  `,
})
export class RunPicker {
  protected readonly store = inject(CompareStore);
  protected readonly min = MIN_COMPARED;
  protected readonly max = MAX_COMPARED;
  readonly compareRuns = output<readonly string[]>();

  protected notReadyText(option: OptionSummary): string {
    const run = option.latestRun;
    if (!run) return 'not run yet';
    if (run.status === 'queued') return 'its run is waiting to start';
    if (run.status === 'running') return `its run is under way (${run.progress.done} of ${run.progress.total} draws)`;
    return `its latest run ${run.status === 'failed' ? 'failed' : 'was cancelled'}`;
  }
}
