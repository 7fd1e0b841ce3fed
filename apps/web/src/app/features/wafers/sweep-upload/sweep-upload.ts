import { HttpEventType } from '@angular/common/http';
import { SITE_PATTERN_IDS } from '@rhotrace/physics';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { KeyValuePipe } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { DropzoneComponent, FileInputDirective, type FileInputValue } from '@ngx-dropzone/cdk';
import {
  COLUMN_MEANINGS,
  type ColumnMeaning,
  SWEEP_METHODS,
  type StationDto,
  type SweepGeometryInput,
  type SweepMethod,
} from '@rhotrace/api-types';
import { ApiError } from '../../../core/http/api-error';
import { Caution } from '../../../shared/caution';
import { Icon } from '../../../shared/icon';
import { WafersApi } from '../wafers-api';
import { MEANING_WORDS, METHOD_WORDS, UNITS_BY_MEANING, unitLabel } from './column-units';
import { type UploadItem, rowProblemsFrom } from './upload-item';

const GEOMETRY_FIELDS: ReadonlyArray<{ key: keyof SweepGeometryInput; label: string }> = [
  { key: 'thicknessCm', label: 'Thickness' },
  { key: 'diameterCm', label: 'Diameter' },
  { key: 'spacingCm', label: 'Probe spacing' },
  { key: 'barLengthCm', label: 'Bar length' },
  { key: 'barWidthCm', label: 'Bar width' },
];

/** How sure the column detection is, in words (a choice made by hand is certain). */
export function confidenceWords(confidence: number): string {
  if (confidence >= 0.9) return 'high';
  if (confidence >= 0.6) return 'medium: check it';
  return 'low: choose by hand';
}

/**
 * Bringing sweeps in: drop or pick files, check what was detected, correct the column mapping,
 * choose method, station and geometry, then store each file with a progress bar.
 */
@Component({
  selector: 'rt-sweep-upload',
  imports: [
    FormsModule,
    KeyValuePipe,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatProgressBarModule,
    DropzoneComponent,
    FileInputDirective,
    Caution,
    Icon,
  ],
  templateUrl: './sweep-upload.html',
  styleUrl: './sweep-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SweepUpload {
  private readonly api = inject(WafersApi);
  protected readonly confidenceWords = confidenceWords;

  readonly waferId = input.required<number>();
  readonly material = input<string | null>(null);
  readonly stations = input<StationDto[]>([]);
  /** Emits the id of each sweep stored. */
  readonly stored = output<number>();

  protected readonly methods = SWEEP_METHODS;
  protected readonly methodWords = METHOD_WORDS;
  protected readonly meanings = COLUMN_MEANINGS;
  protected readonly meaningWords = MEANING_WORDS;
  protected readonly unitsFor = (m: ColumnMeaning) => UNITS_BY_MEANING[m];
  protected readonly unitLabel = unitLabel;
  protected readonly geometryFields = GEOMETRY_FIELDS;

  protected readonly items = signal<UploadItem[]>([]);
  protected readonly method = signal<SweepMethod | null>(null);
  protected readonly stationId = signal<number | null>(null);
  protected readonly geometry = signal<SweepGeometryInput>({});
  /** Map fields: the pattern a `site` column numbers, and the edge exclusion (mm). */
  protected readonly sitePatterns = SITE_PATTERN_IDS;
  protected readonly sitePattern = signal<string>('');
  protected readonly edgeExclusionMm = signal<number | undefined>(undefined);
  /** True when a file's columns place readings at sites. */
  protected readonly hasSites = computed(() =>
    this.items().some((i) => i.columns.some((c) => c.meaning === 'site' || c.meaning === 'site-x')),
  );
  protected readonly ready = computed(() => this.items().filter((i) => i.status === 'ready'));
  protected readonly busy = computed(() =>
    this.items().some((i) => i.status === 'uploading' || i.status === 'reading'),
  );
  private nextKey = 1;

  /** Takes newly chosen or dropped files and previews each. */
  protected addFiles(value: FileInputValue): void {
    const files = value === null ? [] : Array.isArray(value) ? value : [value];
    const known = new Set(this.items().map((i) => i.file));
    for (const file of files) {
      if (known.has(file)) continue;
      const item: UploadItem = {
        key: this.nextKey++,
        file,
        status: 'reading',
        preview: null,
        columns: [],
        mappingEdited: false,
        progressPercent: 0,
        result: null,
        message: null,
        problems: [],
      };
      this.items.update((list) => [...list, item]);
      this.previewFile(item.key, file);
    }
  }

  protected remove(key: number): void {
    this.items.update((list) => list.filter((i) => i.key !== key));
  }

  protected setMeaning(key: number, index: number, meaning: ColumnMeaning): void {
    const units = UNITS_BY_MEANING[meaning];
    this.patchColumn(key, index, (c) => ({
      ...c,
      meaning,
      unit: c.unit && units.includes(c.unit) ? c.unit : (units[0] ?? null),
      confidence: 1,
    }));
  }

  protected setUnit(key: number, index: number, unit: string | null): void {
    this.patchColumn(key, index, (c) => ({ ...c, unit, confidence: 1 }));
  }

  protected setEdgeExclusion(raw: string): void {
    this.edgeExclusionMm.set(raw === '' ? undefined : Number(raw));
  }

  protected setGeometry(key: keyof SweepGeometryInput, raw: string): void {
    const value = raw === '' ? undefined : Number(raw);
    this.geometry.update((g) => ({ ...g, [key]: value }));
  }

  protected problemsAt(item: UploadItem, row: number): string[] {
    return item.problems
      .filter((p) => p.row === row)
      .map((p) => (p.column ? `${p.column}: ${p.problem}` : p.problem));
  }

  /** Stores every file that previewed cleanly, one after another. */
  protected storeAll(): void {
    const method = this.method();
    if (!method) return;
    for (const item of this.ready()) this.storeOne(item, method);
  }

  private storeOne(item: UploadItem, method: SweepMethod): void {
    this.patch(item.key, { status: 'uploading', progressPercent: 0, message: null });
    const columns = item.mappingEdited
      ? item.columns.map((c) => ({ index: c.index, meaning: c.meaning, unit: c.unit }))
      : null;
    this.api
      .store(this.waferId(), item.file, {
        method,
        stationId: this.stationId(),
        columns,
        geometry: this.geometry(),
        map: {
          ...(this.sitePattern() ? { sitePattern: this.sitePattern() } : {}),
          ...(this.edgeExclusionMm() !== undefined
            ? { edgeExclusionMm: this.edgeExclusionMm() }
            : {}),
        },
      })
      .subscribe({
        next: (event) => {
          if (event.type === HttpEventType.UploadProgress) {
            const percent = event.total ? Math.round((100 * event.loaded) / event.total) : 50;
            this.patch(item.key, { progressPercent: percent });
          } else if (event.type === HttpEventType.Response && event.body) {
            this.patch(item.key, { status: 'stored', progressPercent: 100, result: event.body });
            this.stored.emit(event.body.id);
          }
        },
        error: (err: unknown) => {
          const apiError = err instanceof ApiError ? err : null;
          this.patch(item.key, {
            status: 'refused',
            message: apiError?.message ?? 'The upload failed.',
            problems: apiError ? rowProblemsFrom(apiError.details) : [],
          });
        },
      });
  }

  private previewFile(key: number, file: File): void {
    this.api.preview(this.waferId(), file).subscribe({
      next: (preview) => {
        const blocking = preview.problems.length > 0 && preview.rows.length === 0;
        this.patch(key, {
          status: blocking ? 'unreadable' : 'ready',
          preview,
          columns: preview.columns,
          problems: preview.problems,
        });
        if (this.method() === null && preview.suggestedMethod)
          this.method.set(preview.suggestedMethod);
      },
      error: (err: unknown) => {
        const apiError = err instanceof ApiError ? err : null;
        this.patch(key, {
          status: 'unreadable',
          message: apiError?.message ?? 'The file could not be read.',
          problems: apiError ? rowProblemsFrom(apiError.details) : [],
        });
      },
    });
  }

  private patch(key: number, change: Partial<UploadItem>): void {
    this.items.update((list) => list.map((i) => (i.key === key ? { ...i, ...change } : i)));
  }

  private patchColumn(
    key: number,
    index: number,
    edit: (c: UploadItem['columns'][number]) => UploadItem['columns'][number],
  ): void {
    this.items.update((list) =>
      list.map((i) =>
        i.key === key
          ? {
              ...i,
              mappingEdited: true,
              columns: i.columns.map((c) => (c.index === index ? edit(c) : c)),
            }
          : i,
      ),
    );
  }
}
