/**
 * Units found in sweep file headers: how they are spelled and the factor to the SI-like unit
 * Rhotrace stores (K, V, A, ohm, ohm/sq, ohm cm, s, T, and mm for map site coordinates).
 * Temperatures in °C and RTD ohms are not
 * scaled here: they are converted by `@rhotrace/physics`.
 */

/** The physical quantity a unit measures. */
export type UnitKind =
  | 'temperature'
  | 'voltage'
  | 'current'
  | 'resistance'
  | 'sheet-resistance'
  | 'resistivity'
  | 'time'
  | 'length'
  | 'magnetic-field';

/** A recognised unit: canonical label, kind and the factor to the stored unit. */
export interface Unit {
  label: string;
  kind: UnitKind;
  /** Multiply a value in this unit by `factor` to get the stored unit (1 for K and degC). */
  factor: number;
}

const PREFIXES: Record<string, number> = {
  p: 1e-12,
  n: 1e-9,
  u: 1e-6,
  m: 1e-3,
  '': 1,
  k: 1e3,
  M: 1e6,
};

function build(): Map<string, Unit> {
  const table = new Map<string, Unit>();
  const add = (spellings: string[], unit: Unit) => {
    for (const s of spellings) table.set(s, unit);
  };
  add(['k', 'kelvin'], { label: 'K', kind: 'temperature', factor: 1 });
  add(['degc', 'c', 'celsius', 'degreesc', 'degreec', 'deg'], {
    label: 'degC',
    kind: 'temperature',
    factor: 1,
  });
  for (const [p, f] of Object.entries(PREFIXES)) {
    add([`${p}v`, ...(p === '' ? ['volt', 'volts'] : [])], {
      label: `${p}V`,
      kind: 'voltage',
      factor: f,
    });
    add([`${p}a`, ...(p === '' ? ['amp', 'amps', 'ampere'] : [])], {
      label: `${p}A`,
      kind: 'current',
      factor: f,
    });
    add([`${p}ohm`, `${p}ohms`], { label: `${p}ohm`, kind: 'resistance', factor: f });
    add(
      [`${p}ohm/sq`, `${p}ohm_sq`, `${p}ohms/sq`, `${p}ohm/square`, `${p}ohmpersq`, `${p}ohm/□`],
      {
        label: `${p}ohm/sq`,
        kind: 'sheet-resistance',
        factor: f,
      },
    );
    add([`${p}ohm_cm`, `${p}ohmcm`], { label: `${p}ohm_cm`, kind: 'resistivity', factor: f });
    add([`${p}ohm_m`, `${p}ohmm`], { label: `${p}ohm_m`, kind: 'resistivity', factor: f * 100 });
  }
  add(['mm'], { label: 'mm', kind: 'length', factor: 1 });
  add(['cm'], { label: 'cm', kind: 'length', factor: 10 });
  add(['um'], { label: 'um', kind: 'length', factor: 1e-3 });
  // Field in tesla; gauss converted (1 G = 1e-4 T). Case matters: `T`, `mT`, `G`, `kG`.
  add(['T', 'tesla'], { label: 'T', kind: 'magnetic-field', factor: 1 });
  add(['mT'], { label: 'mT', kind: 'magnetic-field', factor: 1e-3 });
  add(['G', 'gauss', 'Gs'], { label: 'G', kind: 'magnetic-field', factor: 1e-4 });
  add(['kG', 'kgauss'], { label: 'kG', kind: 'magnetic-field', factor: 0.1 });
  add(['s', 'sec', 'seconds'], { label: 's', kind: 'time', factor: 1 });
  add(['ms'], { label: 'ms', kind: 'time', factor: 1e-3 });
  add(['min'], { label: 'min', kind: 'time', factor: 60 });
  add(['h', 'hr'], { label: 'h', kind: 'time', factor: 3600 });
  return table;
}

const UNITS = build();

/**
 * Normalises a unit spelling: micro signs to `u`, ohm signs to `ohm`, degree signs to `deg`,
 * spaces and joiners between ohm and cm to `_`. Upper case is kept only where it matters
 * (`M` mega against `m` milli).
 */
function normalise(raw: string): string {
  let s = raw.trim().replace(/[µμ]/g, 'u').replace(/[ΩΩ]/g, 'ohm').replace(/[°º˚]/g, 'deg');
  s = s.replace(/\s+/g, ' ');
  s = s
    .replace(/ohm(?:s)?\s*[·*.\-_ ]?\s*cm$/i, 'ohm_cm')
    .replace(/ohm(?:s)?\s*[·*.\-_ ]\s*m$/i, 'ohm_m');
  s = s.replace(/ohm(?:s)?\s*(?:\/|_| per )\s*(sq|square|□)$/i, 'ohm/sq');
  s = s.replace(/^deg\s*c$/i, 'degc').replace(/^degrees?\s*c(elsius)?$/i, 'degc');
  s = s.replace(/\s/g, '');
  return s;
}

/** The unit a header spelling names, or null when it is not one Rhotrace reads. */
export function parseUnit(raw: string): Unit | null {
  const s = normalise(raw);
  if (s === '') return null;
  // Mega: only an upper-case M before ohm is mega; everything else is matched case-insensitively.
  const mega = /^M(ohm.*)$/.exec(s);
  if (mega) {
    const base = UNITS.get(mega[1]!.toLowerCase());
    return base ? { label: `M${base.label}`, kind: base.kind, factor: base.factor * 1e6 } : null;
  }
  const direct = UNITS.get(s) ?? UNITS.get(s.toLowerCase());
  if (direct) return direct;
  return null;
}

/** A header split into its name and unit. */
export interface HeaderParts {
  name: string;
  unitText: string | null;
  unit: Unit | null;
  /** True when the unit came from a `_suffix` rather than brackets (less certain). */
  fromSuffix: boolean;
}

/**
 * Splits `T (°C)`, `R [kΩ]`, `V / mV`, `temperature_K`, `voltage_mV`, `resistivity_ohm_cm` into
 * name and unit. A suffix counts as a unit only when it is one Rhotrace recognises.
 */
export function splitHeader(header: string): HeaderParts {
  const h = header.trim();
  const bracket = /^(.*?)\s*[([{]\s*([^)\]}]*)\s*[)\]}]\s*$/.exec(h);
  if (bracket) {
    return {
      name: bracket[1]!.trim(),
      unitText: bracket[2]!.trim(),
      unit: parseUnit(bracket[2]!),
      fromSuffix: false,
    };
  }
  const slash = /^(.*?\S)\s+(?:\/|in)\s+(\S.*)$/.exec(h);
  if (slash) {
    const unit = parseUnit(slash[2]!);
    if (unit)
      return { name: slash[1]!.trim(), unitText: slash[2]!.trim(), unit, fromSuffix: false };
  }
  // Suffixes after `_`, `-` or a space; try the longest suffix first (`ohm_cm` before `cm`).
  const parts = h.split(/[_\s-]+/).filter(Boolean);
  for (let cut = 1; cut < parts.length; cut++) {
    const unitText = parts.slice(cut).join('_');
    const unit = parseUnit(unitText);
    if (unit) return { name: parts.slice(0, cut).join(' '), unitText, unit, fromSuffix: true };
  }
  return { name: h, unitText: null, unit: null, fromSuffix: false };
}
