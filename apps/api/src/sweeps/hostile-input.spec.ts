/**
 * Hostile and broken input: one table of files and requests, each with the status a technician
 * (or a script) should get and the reason. For every upload the test checks that a refusal
 * stores nothing (sweeps, points, raw files, audit events), that an error body has the API's
 * shape with a message and no stack trace, and that the server still answers /api/health.
 * The files of `seed-data/bad/` are all in the table; the large cases are generated here.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import request, { type Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../audit/audit-event.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { makeWafer } from './sweep-test-helpers';
import { RawFile, Sweep, SweepPoint } from './sweep.model';

const BAD = fileURLToPath(new URL('../../../../seed-data/bad/', import.meta.url));
const bad = (name: string) => readFileSync(BAD + name);
const GOOD = 'T (K),V (mV),I (mA)\n300,1.5,1.0\n310,1.6,1.0\n320,1.7,1.0\n';
/** A good file made unique, so no case is refused as a duplicate of another. */
const good = (label: string) => Buffer.from(`# ${label}\n${GOOD}`);

/** Stack-trace fragments that must never reach a client. */
const STACK = /\n\s+at |\bat [\w.<>]+ \(|\.ts:\d+|\.js:\d+|node_modules|Error: /;

let ctx: TestContext;

interface Upload {
  /** Wafer the case uploads to (a fresh one per case). */
  waferId: number;
  engineer: { Authorization: string };
}

interface Case {
  name: string;
  status: number;
  reason: string;
  /** Uploads get their counts checked; other requests only the answer and health. */
  kind: 'upload' | 'request';
  send: (u: Upload) => request.Test;
  /** Further checks on the answer (successful cases look at what was stored). */
  check?: (res: Response) => Promise<void>;
}

/** The standard sweep upload of `bytes` as `name`, with extra or replaced text fields. */
function sweepUpload(
  u: Upload,
  bytes: Buffer,
  name = 'sweep.csv',
  fields: Record<string, string> = { method: 'four-point', spacingCm: '0.1' },
): request.Test {
  const req = request(ctx.app).post(`/api/wafers/${u.waferId}/sweeps`).set(u.engineer);
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  return req.attach('file', bytes, name);
}

/** Checks the error message says `pattern` (the technician's clue). */
const says =
  (pattern: RegExp): Case['check'] =>
  async (res) => {
    expect(res.body.error.message).toMatch(pattern);
  };

function fileCase(file: string, status: number, reason: string, check?: Case['check']): Case {
  return {
    name: `seed-data/bad/${file}`,
    status,
    reason,
    kind: 'upload',
    send: (u) => sweepUpload(u, bad(file), file),
    check,
  };
}

function bytesCase(
  name: string,
  status: number,
  reason: string,
  bytes: () => Buffer,
  check?: Case['check'],
): Case {
  return { name, status, reason, kind: 'upload', send: (u) => sweepUpload(u, bytes()), check };
}

/** A multipart body written by hand, for shapes supertest will not produce. */
function rawMultipart(u: Upload, body: string, contentType: string): request.Test {
  return request(ctx.app)
    .post(`/api/wafers/${u.waferId}/sweeps`)
    .set(u.engineer)
    .set('Content-Type', contentType)
    .send(body);
}

const BOUNDARY = 'rhotrace-test-boundary';
const part = (name: string, value: string, file?: string) =>
  `--${BOUNDARY}\r\nContent-Disposition: form-data; name="${name}"` +
  `${file ? `; filename="${file}"\r\nContent-Type: text/csv` : ''}\r\n\r\n${value}\r\n`;

async function storedSweep(res: Response): Promise<Sweep> {
  const sweep = await Sweep.findByPk(res.body.id as number);
  expect(sweep).not.toBeNull();
  return sweep!;
}

async function pointsCsv(id: number): Promise<string> {
  const res = await request(ctx.app).get(`/api/sweeps/${id}/points.csv`).set(ctx.auth('manager'));
  expect(res.status).toBe(200);
  return res.text;
}

async function rawDownload(id: number): Promise<Response> {
  const res = await request(ctx.app).get(`/api/sweeps/${id}/raw`).set(ctx.auth('manager'));
  expect(res.status).toBe(200);
  return res;
}

/** Checks a hostile file name was stored as a harmless label and served as a safe attachment. */
function harmlessName(expected: string, userName: string): Case['check'] {
  return async (res) => {
    const sweep = await storedSweep(res);
    expect(sweep.originalName).toBe(expected);
    expect(sweep.originalName).not.toMatch(/[/\\<>\p{Cc}]|^\./u);
    expect(sweep.storageKey).toMatch(/^raw-[0-9a-f-]{36}$/);
    expect(sweep.storageKey).not.toContain(expected);
    expect(sweep.storageKey).not.toContain(userName);
    const disposition = (await rawDownload(sweep.id)).headers['content-disposition'] as string;
    expect(disposition).toMatch(/^attachment; filename=/);
    expect(disposition).not.toMatch(/[/\\<>\p{Cc}\u202e]|\.\./u);
  };
}

/** The cells of one CSV line (RFC 4180 quotes). */
function csvCells(line: string): string[] {
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i]!;
    if (quoted && ch === '"' && line[i + 1] === '"') {
      cell += '"';
      i++;
    } else if (ch === '"') quoted = !quoted;
    else if (ch === ',' && !quoted) {
      cells.push(cell);
      cell = '';
    } else cell += ch;
  }
  return [...cells, cell];
}

/** A spreadsheet must not run any cell of points.csv as a formula (signed numbers are fine). */
function noFormulaCells(csv: string): void {
  for (const line of csv.split('\r\n')) {
    for (const cell of csvCells(line)) {
      if (/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(cell)) continue;
      expect(cell, line).not.toMatch(/^[=+\-@\t\r]/);
    }
  }
}

const CASES: Case[] = [
  // ---- the corpus in seed-data/bad (every file there) --------------------------------------
  fileCase('good-control.csv', 201, 'the control: a clean file is stored', async (res) => {
    expect(res.body.pointCount).toBe(3);
  }),
  fileCase('empty.csv', 400, 'an empty file is unreadable'),
  fileCase('only-blank-lines.csv', 400, 'blank space only: nothing to read'),
  fileCase('only-comments.csv', 422, 'text, but no row of numbers can be read'),
  fileCase('header-only.csv', 422, 'a header with no data rows'),
  fileCase('html-page.csv', 422, 'an HTML page is text without rows of numbers'),
  fileCase('json-file.csv', 422, 'JSON is text without rows of numbers'),
  fileCase('random-binary.csv', 400, 'binary bytes are not a text export'),
  fileCase('zip-renamed.csv', 400, 'a zip archive renamed .csv is named as such', says(/zip/)),
  fileCase('png-renamed.csv', 400, 'a PNG image renamed .csv is named as such', says(/PNG/)),
  fileCase(
    'pdf-renamed.csv',
    400,
    'a PDF renamed .csv is named as such (its head looks textual)',
    says(/PDF/),
  ),
  fileCase('nul-bytes.csv', 400, 'NUL bytes mean binary data'),
  fileCase(
    'utf16-le.csv',
    400,
    'UTF-16 text is refused with advice to save as UTF-8',
    says(/UTF-16.*UTF-8/),
  ),
  fileCase('invalid-utf8.csv', 422, 'bytes invalid in UTF-8 leave a cell that is not a number'),
  fileCase('old-mac-cr-only.csv', 201, 'CR-only line ends are a readable export', async (res) => {
    expect(res.body.pointCount).toBe(3);
  }),
  fileCase('truncated-mid-number.csv', 422, 'the last row was cut short: it has too few values'),
  fileCase(
    'unterminated-quote.csv',
    422,
    'a quote opened on the last row never closes',
    says(/^Row 3: .*never closed/),
  ),
  fileCase('ragged-rows.csv', 422, 'rows with too few and too many values', async (res) => {
    expect(res.body.error.details.map((d: { row: number }) => d.row)).toEqual([2, 3]);
  }),
  fileCase('empty-cell.csv', 422, 'a voltage cell is empty'),
  fileCase('text-in-number.csv', 422, '"abc" in the voltage column'),
  fileCase('hex-number.csv', 422, 'hexadecimal is not read as a number'),
  fileCase('two-decimal-points.csv', 422, '"1.5.5" is not a number'),
  fileCase('overflow-1e400.csv', 422, '1e400 overflows a double'),
  fileCase('nan-value.csv', 422, 'NaN is not a measurement'),
  fileCase('infinity-value.csv', 422, 'Infinity is not a measurement'),
  fileCase('negative-kelvin.csv', 422, 'below 0 K is not physical'),
  fileCase('zero-kelvin.csv', 422, '0 K is not a measurable temperature'),
  fileCase('below-absolute-zero-celsius.csv', 422, '-300 °C is below absolute zero'),
  fileCase('negative-current.csv', 422, 'a negative current without a polarity column'),
  fileCase('zero-current.csv', 422, 'zero current gives no resistance'),
  fileCase('missing-temperature.csv', 400, 'no temperature column to map: a mapping problem'),
  fileCase('missing-voltage.csv', 400, 'no voltage or resistance column: a mapping problem'),
  fileCase('unrecognised-headers.csv', 400, 'columns a, b, c: the user must map them'),
  fileCase('script-in-header.csv', 400, 'a <script> header is not a current column'),
  fileCase('formula-injection.csv', 422, 'a formula in the temperature cell is not a number'),
  fileCase(
    'formula-in-text-column.csv',
    201,
    'formulas in a text column are kept as data but neutralised in points.csv',
    async (res) => {
      const csv = await pointsCsv(res.body.id as number);
      expect(csv).toContain(`"'=HYPERLINK(""http://x.example"")"`);
      expect(csv).toContain("'@SUM(A1)");
      noFormulaCells(csv);
    },
  ),
  fileCase(
    'duplicate-headers.csv',
    201,
    'two columns headed T (K): the first is the temperature, both keep their raw cells',
    async (res) => {
      const sweep = await request(ctx.app).get(`/api/sweeps/${res.body.id}`).set(ctx.auth('admin'));
      const headers = (sweep.body.columns as Array<{ header: string }>).map((c) => c.header);
      expect(headers).toEqual(['T (K)', 'T (K) #2', 'V (mV)', 'I (mA)']);
      expect(sweep.body.points[0].raw[0].values).toEqual({
        'T (K)': '300',
        'T (K) #2': '300',
        'V (mV)': '1.5',
        'I (mA)': '1.0',
      });
    },
  ),
  fileCase(
    'too-few-points.csv',
    201,
    'two valid readings are stored as measured; the fit is what needs three points',
    async (res) => {
      const fit = await request(ctx.app)
        .post(`/api/sweeps/${res.body.id}/fits`)
        .set(ctx.auth('physicist'))
        .send({ kind: 'tcr' });
      expect(fit.status, JSON.stringify(fit.body)).toBe(400);
      expect(fit.body.error.message).toMatch(/a fit needs at least 3/);
    },
  ),
  fileCase(
    'path-traversal-name.csv',
    201,
    'the content is good; the hostile name is tested by the cases below',
  ),

  // ---- generated files -------------------------------------------------------------------
  bytesCase('5 MB on one line, no line break', 422, 'no row of numbers can be found', () =>
    Buffer.alloc(5 * 1024 * 1024, '7'),
  ),
  bytesCase('1,000,000 commas', 422, 'a million empty cells hold no numbers', () =>
    Buffer.from(','.repeat(1_000_000)),
  ),
  bytesCase(
    'a data row of 300,000 values under a 3-column header',
    422,
    'the row has far more values than the header',
    () => Buffer.from(`${GOOD}${'1.0,'.repeat(300_000)}1.0\n`),
  ),
  bytesCase('20 MB + 1 byte (the default limit)', 413, 'over the upload limit', () => {
    const limit = ctx.config.uploadLimitBytes;
    const head = good('over the limit');
    const pad = Buffer.alloc(limit + 1 - head.length, '#');
    pad[0] = 10;
    return Buffer.concat([head, pad]);
  }),
  bytesCase('NUL byte in the middle of a good row', 400, 'binary data inside text', () =>
    Buffer.from(`T (K),V (mV),I (mA)\n300,1.5\u0000,1.0\n310,1.6,1.0\n`),
  ),
  bytesCase(
    'UTF-16 BE with byte-order mark',
    400,
    'UTF-16 text is refused in words',
    () => Buffer.concat([Buffer.from([0xfe, 0xff]), Buffer.from(GOOD, 'utf16le').swap16()]),
    says(/UTF-16/),
  ),
  bytesCase(
    'an Excel .xls (OLE) renamed .csv',
    400,
    'named as an Office document',
    () =>
      Buffer.concat([Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]), good('xls')]),
    says(/Excel/),
  ),
  bytesCase('gzip renamed .csv', 400, 'named as a gzip archive', () =>
    Buffer.from([0x1f, 0x8b, 0x08, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x03]),
  ),
  bytesCase('Latin-1 degree sign (older software)', 201, 'T (°C) in Latin-1 is read', () =>
    Buffer.from(`# latin1\nT (\u00b0C),V (mV),I (mA)\n20,1.5,1.0\n30,1.6,1.0\n`, 'latin1'),
  ),
  bytesCase(
    'a quote that spans to the end of a 2,000-row file',
    422,
    'the row where the quote opens is named',
    () => {
      const rows = Array.from({ length: 2000 }, (_, i) => `${100 + i * 0.1},1.5,1.0`);
      return Buffer.from(`T (K),V (mV),I (mA)\n${rows.join('\n')}\n310,"1.6,1.0\n320,1.7,1.0\n`);
    },
    says(/^Row 2002: /),
  ),
  {
    name: 'file name with path traversal',
    status: 201,
    reason: 'stored by generated key; the label keeps only the last part of the name',
    kind: 'upload',
    send: (u) => sweepUpload(u, good('traversal'), '../../../etc/passwd.csv'),
    check: harmlessName('passwd.csv', '../../../etc/passwd.csv'),
  },
  {
    name: 'file name with Windows path traversal',
    status: 201,
    reason: 'backslash folders are dropped too',
    kind: 'upload',
    send: (u) => sweepUpload(u, good('win'), '..\\..\\Windows\\win.ini.csv'),
    check: harmlessName('win.ini.csv', '..\\..\\Windows\\win.ini.csv'),
  },
  {
    name: 'file name with HTML and script',
    status: 201,
    reason: 'angle brackets become _ in the label and the download name',
    kind: 'upload',
    send: (u) => sweepUpload(u, good('html name'), '<img src=x onerror=alert(1)>.csv'),
    check: harmlessName('_img src=x onerror=alert(1)_.csv', '<img src=x onerror=alert(1)>'),
  },
  {
    name: 'file name with a right-to-left override',
    status: 201,
    reason: 'direction overrides that disguise an extension are replaced',
    kind: 'upload',
    send: (u) => sweepUpload(u, good('rlo'), 'sweep\u202Evsc.exe'),
    check: harmlessName('sweep_vsc.exe', 'sweep\u202Evsc.exe'),
  },

  // ---- multipart shapes and fields ---------------------------------------------------------
  {
    name: 'missing `file` field',
    status: 400,
    reason: 'the file is required',
    kind: 'upload',
    send: (u) =>
      request(ctx.app)
        .post(`/api/wafers/${u.waferId}/sweeps`)
        .set(u.engineer)
        .field('method', 'four-point'),
  },
  {
    name: 'two files in `file`',
    status: 400,
    reason: 'one sweep per request',
    kind: 'upload',
    send: (u) => sweepUpload(u, good('two a')).attach('file', good('two b'), 'b.csv'),
  },
  {
    name: 'file under an unknown field name',
    status: 400,
    reason: 'only the field `file` takes a file',
    kind: 'upload',
    send: (u) =>
      request(ctx.app)
        .post(`/api/wafers/${u.waferId}/sweeps`)
        .set(u.engineer)
        .field('method', 'four-point')
        .attach('upload', good('wrong field'), 'a.csv'),
  },
  {
    name: 'unknown text field',
    status: 400,
    reason: 'unknown fields are named, not ignored',
    kind: 'upload',
    send: (u) =>
      sweepUpload(u, good('unknown field'), 'a.csv', {
        method: 'four-point',
        spacingCm: '0.1',
        colour: 'red',
      }),
  },
  {
    name: 'unknown method',
    status: 400,
    reason: 'method must be one of the listed ones',
    kind: 'upload',
    send: (u) => sweepUpload(u, good('method'), 'a.csv', { method: 'five-point' }),
  },
  ...['NaN', 'Infinity', '1e400', '-0.1', '0'].map((value): Case => ({
    name: `spacingCm = ${value}`,
    status: 400,
    reason: 'a probe spacing must be a finite length above 0 cm',
    kind: 'upload',
    send: (u) =>
      sweepUpload(u, good(`spacing ${value}`), 'a.csv', {
        method: 'four-point',
        spacingCm: value,
      }),
  })),
  {
    name: 'column mapping of 100,000 nested arrays',
    status: 400,
    reason: 'deep JSON in the mapping field is refused as a bad mapping',
    kind: 'upload',
    send: (u) =>
      sweepUpload(u, good('deep mapping'), 'a.csv', {
        method: 'four-point',
        spacingCm: '0.1',
        columns: `${'['.repeat(100_000)}${']'.repeat(100_000)}`,
      }),
  },
  {
    name: 'a text field over 256 KiB',
    status: 413,
    reason: 'over the field size limit',
    kind: 'upload',
    send: (u) =>
      sweepUpload(u, good('big field'), 'a.csv', {
        method: 'four-point',
        columns: ' '.repeat(300 * 1024),
      }),
  },
  {
    name: 'multipart body cut off before the closing boundary',
    status: 400,
    reason: 'an unfinished upload is not read',
    kind: 'upload',
    send: (u) =>
      rawMultipart(
        u,
        part('method', 'four-point') + part('file', GOOD, 'cut.csv').slice(0, -10),
        `multipart/form-data; boundary=${BOUNDARY}`,
      ),
  },
  {
    name: 'multipart without a boundary',
    status: 400,
    reason: 'the body cannot be split into parts',
    kind: 'upload',
    send: (u) => rawMultipart(u, part('method', 'four-point'), 'multipart/form-data'),
  },
  {
    name: 'JSON to the upload route',
    status: 415,
    reason: 'uploads are multipart/form-data',
    kind: 'upload',
    send: (u) =>
      request(ctx.app)
        .post(`/api/wafers/${u.waferId}/sweeps`)
        .set(u.engineer)
        .send({ method: 'four-point', file: GOOD }),
  },
  {
    name: 'raw text/csv body to the upload route',
    status: 415,
    reason: 'the file must be a multipart field',
    kind: 'upload',
    send: (u) =>
      request(ctx.app)
        .post(`/api/wafers/${u.waferId}/sweeps/preview`)
        .set(u.engineer)
        .set('Content-Type', 'text/csv')
        .send(GOOD),
  },
  {
    name: 'upload to wafer id "abc"',
    status: 400,
    reason: 'malformed id',
    kind: 'upload',
    send: (u) => sweepUpload({ ...u, waferId: 'abc' as unknown as number }, good('abc')),
  },
  {
    name: 'upload to a wafer that does not exist',
    status: 404,
    reason: 'unknown wafer, refused before the body is read',
    kind: 'upload',
    send: (u) => sweepUpload({ ...u, waferId: 2_000_000_000 }, good('missing wafer')),
  },

  // ---- JSON routes -----------------------------------------------------------------------
  {
    name: 'deep JSON body (100,000 nested arrays) to POST /api/lots',
    status: 400,
    reason: 'parsed without a stack overflow and refused as not an object',
    kind: 'request',
    send: (u) =>
      request(ctx.app)
        .post('/api/lots')
        .set(u.engineer)
        .set('Content-Type', 'application/json')
        .send(`${'['.repeat(100_000)}${']'.repeat(100_000)}`),
  },
  {
    name: '2 MB JSON body to POST /api/lots',
    status: 413,
    reason: 'over the 1 MB JSON limit',
    kind: 'request',
    send: (u) =>
      request(ctx.app)
        .post('/api/lots')
        .set(u.engineer)
        .send({ code: 'BIG', material: 'Si', notes: 'x'.repeat(2 * 1024 * 1024) }),
  },
  {
    name: 'text/plain body to POST /api/lots',
    status: 415,
    reason: 'JSON routes take application/json',
    kind: 'request',
    send: (u) =>
      request(ctx.app)
        .post('/api/lots')
        .set(u.engineer)
        .set('Content-Type', 'text/plain')
        .send('{"code":"TXT","material":"Si"}'),
  },
  {
    name: 'multipart body to POST /api/lots',
    status: 415,
    reason: 'multipart is for uploads only',
    kind: 'request',
    send: (u) =>
      request(ctx.app)
        .post('/api/lots')
        .set(u.engineer)
        .field('code', 'MP')
        .field('material', 'Si'),
  },
  {
    name: 'urlencoded body to PATCH /api/lots/1',
    status: 415,
    reason: 'JSON routes take application/json',
    kind: 'request',
    send: (u) =>
      request(ctx.app).patch('/api/lots/1').set(u.engineer).type('form').send('notes=changed'),
  },
  {
    name: 'broken JSON to POST /api/lots',
    status: 400,
    reason: 'not valid JSON',
    kind: 'request',
    send: (u) =>
      request(ctx.app)
        .post('/api/lots')
        .set(u.engineer)
        .set('Content-Type', 'application/json')
        .send('{"code": "BROKEN", '),
  },
  {
    name: 'HTML and script in lot code and notes',
    status: 201,
    reason: 'stored verbatim and answered as JSON, never rendered',
    kind: 'request',
    send: (u) =>
      request(ctx.app).post('/api/lots').set(u.engineer).send({
        code: '<script>alert(1)</script>',
        material: 'Si',
        notes: '<img src=x onerror=alert(1)> "quoted" \'single\' </textarea>',
      }),
    check: async (res) => {
      expect(res.headers['content-type']).toMatch(/^application\/json/);
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      const read = await request(ctx.app).get(`/api/lots/${res.body.id}`).set(ctx.auth('admin'));
      expect(read.headers['content-type']).toMatch(/^application\/json/);
      expect(read.body.code).toBe('<script>alert(1)</script>');
      expect(read.body.notes).toBe('<img src=x onerror=alert(1)> "quoted" \'single\' </textarea>');
    },
  },
  ...['abc', '1e3', '-1', '0', '1.5', '0x10', '99999999999', '%E0%A4%A'].map((id): Case => ({
    name: `GET /api/sweeps/${id}`,
    status: 400,
    reason: 'a malformed id is a 400, never read as another number',
    kind: 'request',
    send: (u) => request(ctx.app).get(`/api/sweeps/${id}`).set(u.engineer),
  })),
  {
    name: 'GET /api/sweeps/2000000000',
    status: 404,
    reason: 'a well-formed id that does not exist',
    kind: 'request',
    send: (u) => request(ctx.app).get('/api/sweeps/2000000000').set(u.engineer),
  },
];

async function counts() {
  return {
    sweeps: await Sweep.count({ paranoid: false }),
    points: await SweepPoint.count(),
    raw: await RawFile.count(),
    audit: await AuditEvent.count({ where: { entity: 'sweep' } }),
  };
}

beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx.close();
});

describe('hostile and broken input', () => {
  it('covers every file in seed-data/bad and at least 40 cases', () => {
    const files = readdirSync(BAD).filter((f) => f !== 'README.md');
    const named = new Set(CASES.map((c) => c.name));
    expect(files.filter((f) => !named.has(`seed-data/bad/${f}`))).toEqual([]);
    expect(CASES.length).toBeGreaterThanOrEqual(40);
    expect(new Set(CASES.map((c) => c.name)).size).toBe(CASES.length);
  });

  it('answers each case with its 4xx (or 201), stores nothing partial and stays up', async () => {
    const engineer = ctx.auth('engineer');
    const failures: string[] = [];
    for (const c of CASES) {
      const wafer = await makeWafer({ thicknessCm: 0.05 });
      const before = await counts();
      const started = Date.now();
      const res = await c.send({ waferId: wafer.id, engineer });
      const took = Date.now() - started;
      const label = `${c.name} (${c.reason}): ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`;
      if (res.status !== c.status) {
        failures.push(label);
        continue;
      }
      expect(took, `${c.name} took ${took} ms`).toBeLessThan(10_000);
      if (c.status >= 400) {
        expect(res.headers['content-type'], label).toMatch(/^application\/json/);
        expect(typeof res.body.error?.code, label).toBe('string');
        expect(res.body.error.message, label).toMatch(/\w{3}/);
        expect(res.text, label).not.toMatch(STACK);
        if (c.kind === 'upload') expect(await counts(), label).toEqual(before);
      } else if (c.kind === 'upload') {
        const sweep = await storedSweep(res);
        expect(await counts(), label).toEqual({
          sweeps: before.sweeps + 1,
          points: before.points + sweep.pointCount,
          raw: before.raw + 1,
          audit: before.audit + 1,
        });
      }
      await c.check?.(res);
      const health = await request(ctx.app).get('/api/health');
      expect(health.status, `health after ${c.name}`).toBe(200);
    }
    expect(failures).toEqual([]);
  }, 120_000);
});
