/**
 * A synthetic Hall sweep of n-type silicon, 20 to 400 K, computed here from the textbook
 * formulas and not through `@rhotrace/physics`, so the import and the fits are checked against
 * numbers made elsewhere:
 * - n(T): charge neutrality n + N_A = N_D / (1 + 2 (n / Nc) exp(E_d / kT)), solved as the
 *   quadratic n^2 + (N_A + phi) n - (N_D - N_A) phi = 0, phi = (Nc / 2) exp(-E_d / kT)
 *   (Blakemore 1962), holes left out (below 400 K they change n by < 1e-4 at 1e15 cm^-3), Nc =
 *   2.69e19 (T / 300)^1.5 cm^-3 (the library's default silicon set, stated in its docs);
 * - mu(T): lattice mobility 4.0e9 T^-2.6 cm^2/(V s) (Morin & Maita 1954, Phys. Rev. 96, 28,
 *   from memory) with a weak impurity term 5e5 (T / 100)^1.5 by Matthiessen's rule;
 * - rho = 1 / (q n mu); R_A = R_B = (ln 2 / pi) rho / t (van der Pauw 1958, symmetric sample);
 *   V_H = R_H I B / t with R_H = -1 / (q n) (r_H = 1), and the four reversals built with an
 *   offset (misalignment, odd in I) and a thermal voltage (even in both).
 */
export const HALL_TRUTH = {
  donorDensityCm3: 1e15,
  acceptorDensityCm3: 1e14,
  donorLevelEv: 0.045,
  latticeExponent: -2.6,
  thicknessCm: 0.05,
  /** Largest current; colder (more resistive) rows use less, as a source keeping ~10 mV would. */
  currentA: 1e-5,
  magneticFieldT: 0.5,
} as const;

const Q = 1.602176634e-19;
const K_EV = 8.617333262e-5;

/** Electron density from the neutrality quadratic, cm^-3. */
export function truthElectronsCm3(t: number): number {
  const { donorDensityCm3: nd, acceptorDensityCm3: na, donorLevelEv: ed } = HALL_TRUTH;
  const phi = ((2.69e19 * (t / 300) ** 1.5) / 2) * Math.exp(-ed / (K_EV * t));
  const b = na + phi;
  return (2 * (nd - na) * phi) / (b + Math.sqrt(b * b + 4 * (nd - na) * phi));
}

/** Hall mobility, cm^2/(V s). */
export function truthMobility(t: number): number {
  return 1 / (1 / (4.0e9 * t ** HALL_TRUTH.latticeExponent) + 1 / (5e5 * (t / 100) ** 1.5));
}

/** Deterministic small noise (mulberry32 and Box–Muller), so the file is the same every time. */
function noise(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/** Options of `hallSweepCsv`. */
export interface HallFileOptions {
  /** Four reversal columns (default) or one corrected Hall-voltage column. */
  layout?: 'reversals' | 'corrected';
  /** Relative noise on n and mu (default 0.01). */
  noise?: number;
  /** Readings per temperature step (default 2). */
  perStep?: number;
  /** Temperatures, K (default 20 to 400 in 10 K steps). */
  temperaturesK?: number[];
}

const fmt = (v: number) => v.toPrecision(10);

/** The file as text (CSV, one header line). */
export function hallSweepCsv(options: HallFileOptions = {}): string {
  const { thicknessCm: t, currentA: i, magneticFieldT: b } = HALL_TRUTH;
  const temps = options.temperaturesK ?? Array.from({ length: 39 }, (_, k) => 20 + 10 * k);
  const per = options.perStep ?? 2;
  const rel = options.noise ?? 0.01;
  const gauss = noise(14);
  const reversals = (options.layout ?? 'reversals') === 'reversals';
  const head = reversals
    ? 'T (K),R_A (ohm),R_B (ohm),I (uA),B (mT),V(+B+I) (mV),V(+B-I) (mV),V(-B+I) (mV),V(-B-I) (mV)'
    : 'T (K),R_A (ohm),R_B (ohm),I (uA),B (mT),V_H (mV)';
  const lines = [head];
  for (const temperature of temps) {
    for (let k = 0; k < per; k++) {
      const n = truthElectronsCm3(temperature) * (1 + rel * gauss());
      const mu = truthMobility(temperature) * (1 + rel * gauss());
      const rho = 1 / (Q * n * mu);
      const r = ((Math.LN2 / Math.PI) * rho) / t;
      // The current a source would pick to keep about 10 mV across the sample (1 nA to i).
      const current = Math.min(i, Math.max(1e-9, 10 ** Math.floor(Math.log10(0.01 / r))));
      const vh = ((-1 / (Q * n)) * current * b * 1e-4) / t;
      const offset = 0.3 * vh;
      const thermal = 2e-6;
      const mV = (v: number) => fmt(v * 1e3);
      const hall = reversals
        ? [
            vh + offset + thermal,
            -vh - offset + thermal,
            -vh + offset + thermal,
            vh - offset + thermal,
          ]
        : [vh];
      lines.push(
        [
          fmt(temperature + 0.02 * k),
          fmt(r),
          fmt(r),
          fmt(current * 1e6),
          fmt(b * 1e3),
          ...hall.map(mV),
        ].join(','),
      );
    }
  }
  return `${lines.join('\n')}\n`;
}
