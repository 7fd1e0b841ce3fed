/**
 * Four-point-probe export files for tests and benchmarks: `rows` readings from 80 K upwards,
 * voltage in mV at 1 mA, with a unique comment line so each call gives a different SHA-256.
 */
let serial = 0;

export function fourPointCsv(rows: number, label = ''): Buffer {
  serial += 1;
  const lines = [
    `# test export ${label} ${process.pid}-${Date.now()}-${serial}`,
    'T (K),V (mV),I (mA)',
  ];
  for (let i = 0; i < rows; i += 1) {
    const temperatureK = 80 + (420 * i) / Math.max(1, rows - 1);
    // a smooth, positive curve with the shape of an extrinsic wafer (values are illustrative only)
    const voltageMv = 2.2 * (temperatureK / 300) ** 1.5 + 0.01 * Math.sin(i);
    lines.push(`${temperatureK.toFixed(4)},${voltageMv.toFixed(6)},1.000`);
  }
  return Buffer.from(`${lines.join('\n')}\n`);
}
