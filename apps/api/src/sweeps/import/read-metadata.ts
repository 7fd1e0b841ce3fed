/**
 * Stage 2b, read the metadata: what the file's metadata lines (`Thickness: 380 um`,
 * `Sample: DEMO-W03`) say about values the records also hold. A value the records lack is
 * filled from the file (`resolveGeometry` takes it last); a value that disagrees is named
 * before storing, the record's value is used unless the user sends the file's, and the parse
 * report keeps the sentence. Recognising a key is `parse/metadata.ts` (one row of its table);
 * comparing it with a record is one entry of `METADATA_CHECKS` here.
 */
import type { MetadataFinding, SweepGeometryInput } from '@rhotrace/api-types';
import type { Lot } from '../../lots/lot.model';
import type { Station } from '../../stations/station.model';
import type { Wafer } from '../../wafers/wafer.model';
import type { RecognisedMetadata } from '../parse';

/** The records a file's metadata is compared with. */
export interface MetadataRecords {
  wafer: Pick<Wafer, 'number' | 'thicknessCm'>;
  lot: Pick<Lot, 'code' | 'thicknessCm' | 'diameterCm'>;
  station: Pick<Station, 'name' | 'probeSpacingCm'> | null;
}

/** Two lengths this close (relative) are the same value written twice (common practice, no source). */
export const SAME_LENGTH = 0.01;

/** One comparison: the file's recognised metadata against the records and the request. */
type MetadataCheck = (
  file: RecognisedMetadata,
  records: MetadataRecords,
  request: SweepGeometryInput,
) => MetadataFinding | null;

/** A length in words: µm below 1 mm, else mm. */
export function lengthText(cm: number): string {
  const [value, unit] = cm < 0.1 ? [cm * 1e4, 'µm'] : [cm * 10, 'mm'];
  return `${Number(value.toPrecision(4))} ${unit}`;
}

const same = (a: number, b: number) => Math.abs(a - b) <= SAME_LENGTH * Math.max(a, b);

/** A check of a length the file gives against the first record that holds it. */
function lengthCheck(
  key: keyof SweepGeometryInput,
  label: string,
  recordOf: (r: MetadataRecords) => [string, number | null | undefined][],
): MetadataCheck {
  return (file, records, request) => {
    const fileValue = file[key];
    if (fileValue === undefined) return null;
    const found = recordOf(records).find(([, v]) => typeof v === 'number' && v > 0);
    const fileText = lengthText(fileValue);
    const asked = request[key];
    const chosenFile = asked !== undefined && same(asked, fileValue);
    if (!found) {
      return {
        key,
        label,
        fileText,
        recordText: null,
        agreement: 'fills',
        field: key,
        fileValue,
        using: 'file',
        sentence: `${label} ${fileText} is taken from the file's header (no record holds one)`,
      };
    }
    const [where, recordValue] = found as [string, number];
    if (same(recordValue, fileValue)) return null;
    const recordText = `${lengthText(recordValue)} on the ${where}`;
    const using = chosenFile ? 'file' : 'record';
    return {
      key,
      label,
      fileText,
      recordText,
      agreement: 'disagrees',
      field: key,
      fileValue,
      using,
      sentence:
        `the file's header gives ${label.toLowerCase()} ${fileText}, the record ${recordText}; ` +
        `the ${using === 'file' ? "file's" : "record's"} value was used`,
    };
  };
}

/** Letters and digits only, lower case: `DEMO-W03` and `demo w03` are one name. */
const plain = (s: string) => s.toLowerCase().replace(/[^\p{L}\p{N}]/gu, '');

/** The sample the file names against the wafer it is uploaded to. */
const sampleCheck: MetadataCheck = (file, { wafer, lot }) => {
  const named = file.sampleName;
  if (named === undefined) return null;
  const name = plain(named);
  const number = plain(wafer.number);
  const code = plain(lot.code);
  if (name === number || name === code + number) return null;
  return {
    key: 'sampleName',
    label: 'Sample',
    fileText: named,
    recordText: `wafer ${wafer.number} of lot ${lot.code}`,
    agreement: 'disagrees',
    field: null,
    fileValue: null,
    using: 'record',
    sentence: `the file names sample "${named}" but was stored on wafer ${wafer.number} of lot ${lot.code}`,
  };
};

/** Every comparison, in the order they are listed. */
export const METADATA_CHECKS: readonly MetadataCheck[] = [
  sampleCheck,
  lengthCheck('thicknessCm', 'Thickness', (r) => [
    ['wafer', r.wafer.thicknessCm],
    ['lot', r.lot.thicknessCm],
  ]),
  lengthCheck('diameterCm', 'Diameter', (r) => [['lot', r.lot.diameterCm]]),
  lengthCheck('spacingCm', 'Probe spacing', (r) => [['station', r.station?.probeSpacingCm]]),
];

/** What the file's metadata fills in or disagrees with, given the request's own values. */
export function readMetadata(
  file: RecognisedMetadata,
  records: MetadataRecords,
  request: SweepGeometryInput,
): MetadataFinding[] {
  return METADATA_CHECKS.map((check) => check(file, records, request)).filter(
    (f): f is MetadataFinding => f !== null,
  );
}
