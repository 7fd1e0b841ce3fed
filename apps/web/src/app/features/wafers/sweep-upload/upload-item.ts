import type {
  FieldProblem,
  ImportSettingsDto,
  ImportSettingsInput,
  RowProblem,
  SweepColumn,
  SweepCreatedResponse,
  SweepPreviewResponse,
} from '@rhotrace/api-types';
import type { SweepChoices } from '../wafers-api';

/** Where one chosen file is in the upload flow. */
export type UploadStatus =
  'reading' | 'checking' | 'ready' | 'blocked' | 'unreadable' | 'uploading' | 'stored' | 'refused';

/** One file of the upload area with everything shown about it. */
export interface UploadItem {
  key: number;
  file: File;
  status: UploadStatus;
  preview: SweepPreviewResponse | null;
  /** This file's own method, station and geometry (preset from what the preview detected). */
  choices: SweepChoices;
  /** The mapping as the user edited it (starts as the detected columns). */
  columns: SweepColumn[];
  mappingEdited: boolean;
  progressPercent: number;
  result: SweepCreatedResponse | null;
  /** The words of the last refusal (kept while the file is corrected and checked again). */
  message: string | null;
  /** What keeps the file from being stored: the preview's blocking list, or a refusal's. */
  problems: RowProblem[];
  /** True once the user said the file belongs here although its header names another sample. */
  confirmedHere: boolean;
  /** The saved import settings this file was preset from (their id), if any. */
  appliedSettingsId: number | null;
  /** The settings this file's choices were saved as, once saved. */
  savedSettings: ImportSettingsDto | null;
}

/** A new item for a chosen file, before its first preview. */
export function newUploadItem(key: number, file: File): UploadItem {
  return {
    key,
    file,
    status: 'reading',
    preview: null,
    choices: { method: null, stationId: null, columns: null, geometry: {} },
    columns: [],
    mappingEdited: false,
    progressPercent: 0,
    result: null,
    message: null,
    problems: [],
    confirmedHere: false,
    appliedSettingsId: null,
    savedSettings: null,
  };
}

/**
 * The metadata disagreements no value choice settles (the file names another sample): the
 * user must confirm the file belongs on this wafer before it is stored.
 */
export function needsConfirmation(item: UploadItem): boolean {
  const findings = item.preview?.metadataFindings ?? [];
  return (
    !item.confirmedHere && findings.some((f) => f.agreement === 'disagrees' && f.field === null)
  );
}

/** The item's choices with its edited mapping, as the preview and the store send them. */
export function choicesOf(item: UploadItem): SweepChoices {
  const columns = item.mappingEdited
    ? item.columns.map((c) => ({ index: c.index, meaning: c.meaning, unit: c.unit }))
    : null;
  return { ...item.choices, columns };
}

/** Server field problems (`row 12, column V (mV)`) as row problems. */
export function rowProblemsFrom(details: FieldProblem[]): RowProblem[] {
  return details.map((d) => {
    const row = /row (\d+)/i.exec(d.field);
    const column = /column (.+)$/i.exec(d.field);
    return {
      row: row ? Number(row[1]) : null,
      column: column?.[1] ?? null,
      problem: d.problem,
      field: d.field,
    };
  });
}

/** The item's choices as import settings for its station and shape (null without either). */
export function settingsOf(item: UploadItem): ImportSettingsInput | null {
  const { preview, choices } = item;
  if (!preview || choices.stationId === null || !choices.method) return null;
  return {
    stationId: choices.stationId,
    shape: preview.shape,
    shapeLabel: preview.shapeLabel,
    method: choices.method,
    columns: item.columns.map((c) => ({ index: c.index, meaning: c.meaning, unit: c.unit })),
    geometry: Object.fromEntries(
      Object.entries(choices.geometry).filter(([, v]) => typeof v === 'number'),
    ),
    layout: choices.layout ?? {},
    // The method's own fields: a Hall file's factor, a map's pattern and edge exclusion.
    ...(choices.method === 'hall' && choices.hallFactor !== undefined
      ? { hallFactor: choices.hallFactor }
      : {}),
    ...(choices.map ? { map: { ...choices.map } } : {}),
  };
}

/** The choices and mapping saved settings give a file (its columns from the preview). */
export function presetFrom(
  item: UploadItem,
  settings: ImportSettingsDto,
  columns: SweepColumn[],
): Partial<UploadItem> {
  const byIndex = new Map(settings.columns.map((c) => [c.index, c]));
  return {
    appliedSettingsId: settings.id,
    choices: {
      ...item.choices,
      method: settings.method,
      stationId: settings.stationId,
      geometry: { ...settings.geometry },
      layout: { ...settings.layout },
      hallFactor: settings.hallFactor ?? item.choices.hallFactor,
      map: settings.map ? { ...settings.map } : item.choices.map,
    },
    mappingEdited: byIndex.size > 0,
    columns: columns.map((c) => {
      const saved = byIndex.get(c.index);
      return saved ? { ...c, meaning: saved.meaning, unit: saved.unit ?? null, confidence: 1 } : c;
    }),
  };
}
