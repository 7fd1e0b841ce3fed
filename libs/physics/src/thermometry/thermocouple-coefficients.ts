/**
 * ITS-90 thermocouple reference functions: the coefficients of NIST Monograph 175 (G. W. Burns,
 * M. G. Scroger, G. F. Strouse, M. C. Croarkin, W. F. Guthrie, "Temperature-Electromotive Force
 * Reference Functions and Tables for the Letter-Designated Thermocouple Types Based on the
 * ITS-90", NIST, 1993), the same functions as IEC 60584-1:2013, as distributed in the NIST ITS-90
 * Thermocouple Database (srdata.nist.gov/its90, file allcoeff.tab).
 *
 * Each range gives E = sum c_i t^i (+ for type K above 0 °C: a0 exp(a1 (t - a2)^2)), t in °C,
 * E in mV, reference junction at 0 °C. The lists here hold c_n first and c_0 last (Horner order);
 * the published tables list c_0 first.
 */

/** The eight letter-designated thermocouple types of IEC 60584-1 / NIST Monograph 175. */
export const THERMOCOUPLE_TYPES = ['B', 'E', 'J', 'K', 'N', 'R', 'S', 'T'] as const;
/** One of the letter-designated types (B, E, J, K, N, R, S, T). */
export type ThermocoupleType = (typeof THERMOCOUPLE_TYPES)[number];

/** One temperature range of a reference function. */
export interface ReferenceRange {
  minCelsius: number;
  maxCelsius: number;
  /** c_n ... c_0, mV per °C^i. */
  hornerCoefficients: readonly number[];
  /** Type K above 0 °C: a0 (mV), a1 (1/°C^2), a2 (°C) of a0 exp(a1 (t - a2)^2). */
  exponential?: readonly [number, number, number];
}

/** The reference function ranges of each type, in rising temperature. */
export const THERMOCOUPLE_REFERENCE: Readonly<Record<ThermocoupleType, readonly ReferenceRange[]>> =
  {
    B: [
      {
        minCelsius: 0,
        maxCelsius: 630.615,
        hornerCoefficients: [
          0.62990347094e-18, -0.1694452924e-14, 0.15668291901e-11, -0.13257931636e-8,
          0.59040421171e-5, -0.24650818346e-3, 0,
        ],
      },
      {
        minCelsius: 630.615,
        maxCelsius: 1820,
        hornerCoefficients: [
          -0.93791330289e-24, 0.98975640821e-20, -0.44515431033e-16, 0.11109794013e-12,
          -0.16835344864e-9, 0.15785280164e-6, -0.84885104785e-4, 0.2857174747e-1, -0.38938168621e1,
        ],
      },
    ],
    E: [
      {
        minCelsius: -270,
        maxCelsius: 0,
        hornerCoefficients: [
          -0.34657842013e-28, -0.55827328721e-25, -0.39673619516e-22, -0.16414776355e-19,
          -0.43979497391e-17, -0.80370123621e-15, -0.10287605534e-12, -0.93214058667e-11,
          -0.59452583057e-9, -0.25800160843e-7, -0.77998048686e-6, 0.45410977124e-4,
          0.58665508708e-1, 0,
        ],
      },
      {
        minCelsius: 0,
        maxCelsius: 1000,
        hornerCoefficients: [
          0.35960899481e-27, -0.14388041782e-23, 0.21489217569e-20, -0.12536600497e-17,
          -0.19197495504e-15, 0.6502440327e-12, -0.33056896652e-9, 0.28908407212e-7,
          0.45032275582e-4, 0.5866550871e-1, 0,
        ],
      },
    ],
    J: [
      {
        minCelsius: -210,
        maxCelsius: 760,
        hornerCoefficients: [
          0.15631725697e-22, -0.12538395336e-18, 0.20948090697e-15, -0.17052958337e-12,
          0.13228195295e-9, -0.8568106572e-7, 0.3047583693e-4, 0.50381187815e-1, 0,
        ],
      },
      {
        minCelsius: 760,
        maxCelsius: 1200,
        hornerCoefficients: [
          -0.30691369056e-12, 0.15720819004e-8, -0.31847686701e-5, 0.31787103924e-2,
          -0.14976127786e1, 0.29645625681e3,
        ],
      },
    ],
    K: [
      {
        minCelsius: -270,
        maxCelsius: 0,
        hornerCoefficients: [
          -0.16322697486e-22, -0.19889266878e-19, -0.10451609365e-16, -0.31088872894e-14,
          -0.57410327428e-12, -0.67509059173e-10, -0.49904828777e-8, -0.32858906784e-6,
          0.23622373598e-4, 0.39450128025e-1, 0,
        ],
      },
      {
        minCelsius: 0,
        maxCelsius: 1372,
        hornerCoefficients: [
          -0.12104721275e-25, 0.97151147152e-22, -0.32020720003e-18, 0.56075059059e-15,
          -0.56072844889e-12, 0.31840945719e-9, -0.99457592874e-7, 0.18558770032e-4,
          0.38921204975e-1, -0.17600413686e-1,
        ],
        exponential: [0.1185976, -0.1183432e-3, 0.1269686e3],
      },
    ],
    N: [
      {
        minCelsius: -270,
        maxCelsius: 0,
        hornerCoefficients: [
          -0.93419667835e-19, -0.76089300791e-16, -0.22653438003e-13, -0.26303357716e-11,
          -0.46412039759e-10, -0.93841111554e-7, 0.10957484228e-4, 0.26159105962e-1, 0,
        ],
      },
      {
        minCelsius: 0,
        maxCelsius: 1300,
        hornerCoefficients: [
          -0.30682196151e-28, 0.20849229339e-24, -0.60863245607e-21, 0.99745338992e-18,
          -0.10063471519e-14, 0.64311819339e-12, -0.25261169794e-9, 0.43825627237e-7,
          0.1571014188e-4, 0.25929394601e-1, 0,
        ],
      },
    ],
    R: [
      {
        minCelsius: -50,
        maxCelsius: 1064.18,
        hornerCoefficients: [
          -0.281038625251e-26, 0.157716482367e-22, -0.373105886191e-19, 0.500777441034e-16,
          -0.462347666298e-13, 0.356916001063e-10, -0.238855693017e-7, 0.139166589782e-4,
          0.528961729765e-2, 0,
        ],
      },
      {
        minCelsius: 1064.18,
        maxCelsius: 1664.5,
        hornerCoefficients: [
          -0.293359668173e-15, 0.205305291024e-11, -0.764085947576e-8, 0.159564501865e-4,
          -0.252061251332e-2, 0.295157925316e1,
        ],
      },
      {
        minCelsius: 1664.5,
        maxCelsius: 1768.1,
        hornerCoefficients: [
          -0.934633971046e-14, -0.345895706453e-7, 0.171280280471e-3, -0.268819888545,
          0.152232118209e3,
        ],
      },
    ],
    S: [
      {
        minCelsius: -50,
        maxCelsius: 1064.18,
        hornerCoefficients: [
          0.271443176145e-23, -0.125068871393e-19, 0.255744251786e-16, -0.331465196389e-13,
          0.322028823036e-10, -0.232477968689e-7, 0.12593428974e-4, 0.540313308631e-2, 0,
        ],
      },
      {
        minCelsius: 1064.18,
        maxCelsius: 1664.5,
        hornerCoefficients: [
          0.129989605174e-13, -0.164856259209e-8, 0.654805192818e-5, 0.334509311344e-2,
          0.132900444085e1,
        ],
      },
      {
        minCelsius: 1664.5,
        maxCelsius: 1768.1,
        hornerCoefficients: [
          -0.943223690612e-14, -0.330439046987e-7, 0.163693574641e-3, -0.258430516752,
          0.146628232636e3,
        ],
      },
    ],
    T: [
      {
        minCelsius: -270,
        maxCelsius: 0,
        hornerCoefficients: [
          0.79795153927e-30, 0.13945027062e-26, 0.1079553927e-23, 0.48768662286e-21,
          0.14251594779e-18, 0.28213521925e-16, 0.38493939883e-14, 0.36071154205e-12,
          0.22651156593e-10, 0.90138019559e-9, 0.20032973554e-7, 0.11844323105e-6, 0.44194434347e-4,
          0.38748106364e-1, 0,
        ],
      },
      {
        minCelsius: 0,
        maxCelsius: 400,
        hornerCoefficients: [
          -0.27512901673e-19, 0.4547913529e-16, -0.30815758772e-13, 0.10996880928e-10,
          -0.21882256846e-8, 0.20618243404e-6, 0.3329222788e-4, 0.38748106364e-1, 0,
        ],
      },
    ],
  };
