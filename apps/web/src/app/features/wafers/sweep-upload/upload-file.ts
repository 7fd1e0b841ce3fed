import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import {
  COLUMN_MEANINGS,
  GEOMETRY_SOURCE_WORDS,
  type ColumnMeaning,
  SWEEP_METHODS,
  type MetadataFinding,
  type StationDto,
  type SweepGeometryInput,
  cmToLength,
  lengthToCm,
} from '@rhotrace/api-types';
import { formatDay, formatLength, lengthUnitOf } from '../../../shared/format';
import {
  DECIMAL_WORDS,
  DELIMITER_WORDS,
  METHOD_WORDS,
  UNITS_BY_MEANING,
  confidenceWords,
  meaningChoice,
  unitLabel,
} from './column-units';
import type { SweepLayoutChoice } from '../wafers-api';
import type { UploadItem } from './upload-item';
import { UploadHallFields } from './upload-hall-fields';
import { UploadMapFields } from './upload-map-fields';
import { UploadStore } from './upload-store';

const GEOMETRY_FIELDS: ReadonlyArray<{ key: keyof SweepGeometryInput; label: string }> = [
  { key: 'thicknessCm', label: 'Thickness' },
  { key: 'diameterCm', label: 'Diameter' },
  { key: 'spacingCm', label: 'Probe spacing' },
  { key: 'barLengthCm', label: 'Bar length' },
  { key: 'barWidthCm', label: 'Bar width' },
];

/**
 * One file of an upload: its own method, station and geometry, what each column holds, its
 * first rows, and what the server's checks found (blocking problems and warnings).
 */
@Component({
  selector: 'rt-upload-file',
  imports: [
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatProgressBarModule,
    MatRadioModule,
    UploadMapFields,
    UploadHallFields,
  ],
  templateUrl: './upload-file.html',
  styleUrl: './sweep-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadFile {
  protected readonly store = inject(UploadStore);

  readonly item = input.required<UploadItem>();
  readonly stations = input<StationDto[]>([]);

  protected readonly methods = SWEEP_METHODS;
  protected readonly methodWords = METHOD_WORDS;
  /** Every meaning a column may hold, "is not used" last. */
  protected readonly meanings = [...COLUMN_MEANINGS.filter((m) => m !== 'other'), 'other' as const];
  protected readonly meaningChoice = meaningChoice;
  protected readonly unitsFor = (m: ColumnMeaning) => UNITS_BY_MEANING[m];
  protected readonly unitLabel = unitLabel;
  protected readonly geometryFields = GEOMETRY_FIELDS;
  protected readonly unit = lengthUnitOf;
  protected readonly day = formatDay;
  protected readonly delimiterWords = DELIMITER_WORDS;
  protected readonly decimalWords = DECIMAL_WORDS;
  protected readonly delimiters = Object.keys(DELIMITER_WORDS) as Array<
    keyof typeof DELIMITER_WORDS
  >;
  protected readonly decimalMarks = Object.keys(DECIMAL_WORDS) as Array<keyof typeof DECIMAL_WORDS>;
  /** True while the separator and decimal mark controls are open. */
  protected readonly changingLayout = signal(false);
  protected readonly editable = computed(() =>
    ['ready', 'blocked', 'refused', 'checking'].includes(this.item().status),
  );

  /** The first values of a column, as the file writes them. */
  protected samples(index: number): string {
    const rows = this.item().preview?.rows ?? [];
    return rows
      .slice(0, 3)
      .map((r) => r.cells[index] ?? '')
      .join(', ');
  }

  /** The file's header lines (`key: value`), all of them, as one line of text. */
  protected headerLines(): string {
    const metadata = this.item().preview?.metadata ?? {};
    return Object.entries(metadata)
      .map(([k, v]) => `${k}: ${v}`)
      .join(' · ');
  }

  /** How the temperature column will be converted, or why it cannot be yet, in words. */
  protected temperatureWords(): string {
    const p = this.item().preview;
    if (p?.temperature) return `Temperatures: ${p.temperature.description}.`;
    return p?.temperatureNote ? `Temperatures cannot be converted yet: ${p.temperatureNote}` : '';
  }

  /** What the server would use for a geometry value left empty, in words. */
  protected geometryHint(key: keyof SweepGeometryInput): string {
    const g = this.item().preview?.geometry;
    const value = g?.[key];
    if (value === undefined || !g) return '';
    return `${formatLength(value, key)} ${GEOMETRY_SOURCE_WORDS[g.sources[key] ?? ''] ?? ''}`;
  }

  /** A chosen length (cm) as typed in its field's unit (µm, mm); empty when not chosen. */
  protected shownLength(key: keyof SweepGeometryInput): string {
    const valueCm = this.item().choices.geometry[key];
    return valueCm === undefined ? '' : String(cmToLength(valueCm, lengthUnitOf(key)));
  }

  /** Takes a length typed in its field's unit and keeps it in cm, as the API reads it. */
  protected setGeometry(key: keyof SweepGeometryInput, raw: string): void {
    const value = raw.trim() === '' ? undefined : lengthToCm(Number(raw), lengthUnitOf(key));
    const geometry = { ...this.item().choices.geometry, [key]: value };
    this.store.choose(this.item().key, { geometry });
  }

  /** An unsure column guess in words ("detection: medium: check it"); empty when sure. */
  protected guessNote(confidence: number): string {
    return confidence < 0.9 ? `detection: ${confidenceWords(confidence)}` : '';
  }

  protected setLayout(change: SweepLayoutChoice): void {
    const layout = { ...this.item().choices.layout, ...change };
    this.store.choose(this.item().key, { layout });
  }

  /** Converts with the file's value of a disagreeing length, or with the record's again. */
  protected useFileValue(finding: MetadataFinding, useFile: boolean): void {
    if (!finding.field) return;
    const value = useFile ? (finding.fileValue ?? undefined) : undefined;
    const geometry = { ...this.item().choices.geometry, [finding.field]: value };
    this.store.choose(this.item().key, { geometry });
  }

  protected problemsAt(row: number): string[] {
    return this.item()
      .problems.filter((p) => p.row === row)
      .map((p) => (p.column ? `${p.column}: ${p.problem}` : p.problem));
  }
}
