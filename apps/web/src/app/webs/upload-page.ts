import { ChangeDetectionStrategy, Component, Injector, OnInit, afterNextRender, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { UploadProblems } from './upload-problems';
import { UploadStore } from './upload-store';

/** Bring in a baseline: a workbook, CSV tables or a WEB.json file becomes a new web with a first draft. */
@Component({
  selector: 'sw-upload-page',
  imports: [FormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, UploadProblems],
  providers: [UploadStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './upload-page.html',
  styleUrl: './upload-page.scss',
})
export class UploadPage implements OnInit {
  protected readonly store = inject(UploadStore);
  private readonly router = inject(Router);
  private readonly injector = inject(Injector);

  protected readonly files = signal<File[]>([]);
  protected readonly name = signal('');
  protected readonly unit = signal('');
  protected readonly place = signal('');
  protected readonly period = signal('');
  protected readonly note = signal('');
  protected readonly missingFile = signal(false);

  ngOnInit(): void {
    this.store.findExample();
  }

  protected chooseFiles(input: HTMLInputElement): void {
    this.files.set(Array.from(input.files ?? []));
    this.missingFile.set(false);
  }

  protected async uploadWeb(): Promise<void> {
    if (this.files().length === 0) {
      this.missingFile.set(true);
      return;
    }
    const created = await this.store.upload(this.files(), {
      name: this.name().trim(),
      unit: this.unit().trim(),
      place: this.place().trim(),
      period: this.period().trim(),
      note: this.note().trim(),
    });
    if (created) this.router.navigate(['/webs', created.id], { queryParams: { version: created.versionId } });
    // a refused upload: take the person (and their screen reader) to the list of problems
    else afterNextRender(() => document.getElementById('upload-problems-title')?.focus(), { injector: this.injector });
  }
}
