import { HttpEventType } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { ColumnMeaning, SweepPreviewResponse } from '@rhotrace/api-types';
import { EMPTY, Subject, catchError, groupBy, mergeMap, switchMap, tap } from 'rxjs';
import { ApiError } from '../../../core/http/api-error';
import { WafersApi, type SweepChoices } from '../wafers-api';
import { UNITS_BY_MEANING } from './column-units';
import {
  type UploadItem,
  choicesOf,
  needsConfirmation,
  newUploadItem,
  presetFrom,
  rowProblemsFrom,
  settingsOf,
} from './upload-item';

/**
 * The files of one upload area: each is checked by the server's preview with its own choices
 * (again after every change, the newest check winning), and stored when nothing blocks it.
 */
@Injectable()
export class UploadStore {
  private readonly api = inject(WafersApi);
  private readonly checks = new Subject<number>();
  private nextKey = 1;

  /** The wafer the files go to (set by the upload area). */
  readonly waferId = signal(0);
  readonly items = signal<UploadItem[]>([]);
  /** Files the server's checks passed, ready to be stored. */
  readonly ready = computed(() =>
    this.items().filter((i) => i.status === 'ready' && !needsConfirmation(i)),
  );
  /** Files that cannot be stored as they are. */
  readonly blocked = computed(() =>
    this.items().filter((i) => i.status === 'blocked' || needsConfirmation(i)),
  );
  readonly busy = computed(() =>
    this.items().some((i) => ['reading', 'checking', 'uploading'].includes(i.status)),
  );
  /** True when a file is to be stored as a Hall sweep (a magnet's cautions apply). */
  readonly measuresHall = computed(() => this.items().some((i) => i.choices.method === 'hall'));
  /** Ids of the sweeps stored, in order. */
  readonly stored = new Subject<number>();

  constructor() {
    this.checks
      .pipe(
        groupBy((key) => key),
        mergeMap((keys) => keys.pipe(switchMap((key) => this.check(key)))),
        takeUntilDestroyed(),
      )
      .subscribe();
  }

  /** Adds files not already listed and checks each. */
  add(files: File[]): void {
    const known = new Set(this.items().map((i) => i.file));
    for (const file of files) {
      if (known.has(file)) continue;
      const item = newUploadItem(this.nextKey++, file);
      this.items.update((list) => [...list, item]);
      this.checks.next(item.key);
    }
  }

  remove(key: number): void {
    this.items.update((list) => list.filter((i) => i.key !== key));
  }

  /**
   * Changes a file's method, station, geometry or layout and checks it again. Another separator
   * gives other columns, so the mapping then starts again from what is detected.
   */
  choose(key: number, change: Partial<SweepChoices>): void {
    this.patch(key, (i) => ({
      choices: { ...i.choices, ...change },
      ...(change.layout ? { mappingEdited: false } : {}),
    }));
    this.recheck(key);
  }

  /** Records that the file belongs on this wafer although its header names another sample. */
  confirmHere(key: number, confirmed: boolean): void {
    this.patch(key, () => ({ confirmedHere: confirmed }));
  }

  /** Saves the file's choices as its station's settings for files of this shape. */
  saveSettings(key: number): void {
    const item = this.items().find((i) => i.key === key);
    const settings = item && settingsOf(item);
    if (!settings) return;
    this.api
      .saveImportSettings(settings)
      .subscribe((saved) =>
        this.patch(key, () => ({ savedSettings: saved, appliedSettingsId: saved.id })),
      );
  }

  /** Gives a column another meaning (and a unit that fits it) and checks again. */
  setMeaning(key: number, index: number, meaning: ColumnMeaning): void {
    const units = UNITS_BY_MEANING[meaning];
    this.editColumn(key, index, (c) => ({
      meaning,
      unit: c.unit && units.includes(c.unit) ? c.unit : (units[0] ?? null),
    }));
  }

  setUnit(key: number, index: number, unit: string | null): void {
    this.editColumn(key, index, () => ({ unit }));
  }

  /** Stores every file whose checks passed, each with its own choices. */
  storeReady(): void {
    for (const item of this.ready()) this.storeOne(item);
  }

  private storeOne(item: UploadItem): void {
    const choices = choicesOf(item);
    if (!choices.method) return;
    this.patch(item.key, () => ({ status: 'uploading', progressPercent: 0, message: null }));
    this.api.store(this.waferId(), item.file, { ...choices, method: choices.method }).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress) {
          const percent = event.total ? Math.round((100 * event.loaded) / event.total) : 50;
          this.patch(item.key, () => ({ progressPercent: percent }));
        } else if (event.type === HttpEventType.Response && event.body) {
          const result = event.body;
          this.patch(item.key, () => ({ status: 'stored', progressPercent: 100, result }));
          this.stored.next(result.id);
        }
      },
      error: (err: unknown) => {
        const apiError = err instanceof ApiError ? err : null;
        this.patch(item.key, () => ({
          status: 'refused',
          message: apiError?.message ?? 'The upload failed.',
          problems: apiError ? rowProblemsFrom(apiError.details) : [],
        }));
      },
    });
  }

  private recheck(key: number): void {
    this.patch(key, (i) => (i.status === 'reading' ? {} : { status: 'checking' }));
    this.checks.next(key);
  }

  /** One preview of the file with its current choices; the answer updates the item. */
  private check(key: number) {
    const item = this.items().find((i) => i.key === key);
    if (!item) return EMPTY;
    const first = item.preview === null;
    return this.api.preview(this.waferId(), item.file, first ? undefined : choicesOf(item)).pipe(
      tap((preview) => {
        this.patch(key, (i) => this.checked(i, preview, first));
        const offered = preview.savedSettings;
        const now = this.items().find((i) => i.key === key);
        if (offered && now && offered.id !== now.appliedSettingsId) {
          // Offered settings preset the file; it is checked again with them.
          this.patch(key, (i) => presetFrom(i, offered, preview.columns));
          this.recheck(key);
        }
      }),
      catchError((err: unknown) => {
        const apiError = err instanceof ApiError ? err : null;
        this.patch(key, () => ({
          status: first ? 'unreadable' : 'blocked',
          message: apiError?.message ?? 'The file could not be read.',
          problems: apiError ? rowProblemsFrom(apiError.details) : [],
        }));
        return EMPTY;
      }),
    );
  }

  /** The item after a preview: its verdict, and on the first one the detected choices. */
  private checked(i: UploadItem, preview: SweepPreviewResponse, first: boolean) {
    const detected = first
      ? {
          choices: { ...i.choices, method: preview.method, stationId: preview.stationId },
        }
      : {};
    return {
      ...detected,
      status: preview.blocking.length ? ('blocked' as const) : ('ready' as const),
      preview,
      columns: i.mappingEdited ? i.columns : preview.columns,
      problems: preview.blocking,
    };
  }

  private editColumn(
    key: number,
    index: number,
    edit: (c: UploadItem['columns'][number]) => Partial<UploadItem['columns'][number]>,
  ): void {
    this.patch(key, (i) => ({
      mappingEdited: true,
      columns: i.columns.map((c) => (c.index === index ? { ...c, ...edit(c), confidence: 1 } : c)),
    }));
    this.recheck(key);
  }

  private patch(key: number, change: (i: UploadItem) => Partial<UploadItem>): void {
    this.items.update((list) => list.map((i) => (i.key === key ? { ...i, ...change(i) } : i)));
  }
}
