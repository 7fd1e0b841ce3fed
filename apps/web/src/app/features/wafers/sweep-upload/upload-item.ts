import type {
  FieldProblem,
  RowProblem,
  SweepColumn,
  SweepCreatedResponse,
  SweepPreviewResponse,
} from '@rhotrace/api-types';

/** Where one chosen file is in the upload flow. */
export type UploadStatus = 'reading' | 'ready' | 'unreadable' | 'uploading' | 'stored' | 'refused';

/** One file of the upload area with everything shown about it. */
export interface UploadItem {
  key: number;
  file: File;
  status: UploadStatus;
  preview: SweepPreviewResponse | null;
  /** The mapping as the user edited it (starts as the detected columns). */
  columns: SweepColumn[];
  mappingEdited: boolean;
  progressPercent: number;
  result: SweepCreatedResponse | null;
  message: string | null;
  /** Problems by row and column, from the preview or from a refused store. */
  problems: RowProblem[];
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
