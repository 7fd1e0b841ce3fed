#!/usr/bin/env python3
"""
Writes the example sweep exports in this folder and, beside each, a sidecar JSON with the values
an import must produce. The expectations are computed here, independently of the TypeScript
physics library, straight from the published formulas:

- collinear four-point probe on a slab with an insulating base, method of images
  (L. B. Valdes, Proc. IRE 42, 420, 1954; F. M. Smits, Bell Syst. Tech. J. 37, 711, 1958):
  rho = 2 pi s (V/I) / S(t/s), S = 1 + 4 sum_n [1/sqrt(1+(2n t/s)^2) - 1/sqrt(4+(2n t/s)^2)],
  summed directly to a million terms; finite circular slice C(d/s) = pi / (ln 2 + ln((r^2+3)/(r^2-3)));
- van der Pauw, exp(-pi R_A/R_s) + exp(-pi R_B/R_s) = 1 solved by bisection
  (L. J. van der Pauw, Philips Res. Rep. 13, 1, 1958);
- IEC 60751 platinum RTD above 0 degC, R = R0 (1 + A t + B t^2), A = 3.9083e-3, B = -5.775e-7,
  inverted with the quadratic formula;
- T/K = t/degC + 273.15; forward/reverse average V = (V+ - V-)/2 over I = (I+ - I-)/2.
All readings are invented. Run: python3 expected-values.py
"""
import json
import math
import random
from pathlib import Path

HERE = Path(__file__).resolve().parent
random.seed(20240611)


def thickness_factor(t, s):
    tau = t / s
    total = 0.0
    for n in range(1, 1_000_001):
        u = 2 * n * tau
        total += 1 / math.sqrt(1 + u * u) - 1 / math.sqrt(4 + u * u)
    big_s = 1 + 4 * total
    return 2 * math.log(2) / (tau * big_s)


def four_point(v, i, s, t, d=None):
    c = math.pi / math.log(2) if d is None else math.pi / (math.log(2) + math.log(((d / s) ** 2 + 3) / ((d / s) ** 2 - 3)))
    rs = c * v / i
    return rs, rs * t * thickness_factor(t, s)


def van_der_pauw(ra, rb):
    lo, hi = 1e-9, 1e9
    f = lambda rs: math.exp(-math.pi * ra / rs) + math.exp(-math.pi * rb / rs) - 1
    for _ in range(300):
        mid = math.sqrt(lo * hi)
        if f(mid) < 0:
            lo = mid
        else:
            hi = mid
    return math.sqrt(lo * hi)


def rtd_celsius(r, r0):
    a, b = 3.9083e-3, -5.775e-7
    return (-a + math.sqrt(a * a - 4 * b * (1 - r / r0))) / (2 * b)


def rtd_ohm(celsius, r0):
    return r0 * (1 + 3.9083e-3 * celsius - 5.775e-7 * celsius ** 2)


def rho_model(temperature_k, rho300):
    """An invented silicon-like curve: extrinsic rise, intrinsic fall above ~450 K."""
    extrinsic = rho300 * (temperature_k / 300) ** 2.2
    intrinsic = 1 / (1 / extrinsic + 4e4 * math.exp(-0.56 / (8.617e-5 * temperature_k)) / rho300)
    return intrinsic


def noisy(x, share=0.002):
    return x * (1 + random.gauss(0, share))


def write(name, text, sidecar, encoding='utf-8', bom=False, newline='\n'):
    data = text.replace('\n', newline)
    raw = (('\ufeff' if bom else '') + data).encode(encoding)
    (HERE / name).write_bytes(raw)
    sidecar['file'] = name
    sidecar['bytes'] = len(raw)
    (HERE / (name.rsplit('.', 1)[0] + '.expected.json')).write_text(json.dumps(sidecar, indent=2) + '\n')


def pick(points, rows):
    return [p for p in points if p['row'] in rows]


# 1. comma, kelvin, V and I in SI units, four-point probe, geometry from the records.
def comma_kelvin():
    s, t = 0.1, 0.0525
    lines = ['temperature_K,current_A,voltage_V']
    points = []
    for k in range(24):
        temp = 80 + k * 20
        i = 1.0e-3
        rho = rho_model(temp, 8.0)
        rs_expected = rho / (t * thickness_factor(t, s))
        v = noisy(rs_expected * i / (math.pi / math.log(2)))
        v_text = f'{v:.6e}'
        rs, rho_calc = four_point(float(v_text), i, s, t)
        row = k + 2
        lines.append(f'{temp:.2f},{i:.3e},{v_text}')
        points.append({'row': row, 'sequence': k + 1, 'temperatureK': temp, 'sheetResistanceOhmSq': rs, 'resistivityOhmCm': rho_calc, 'flags': []})
    write('comma-kelvin-four-point.csv', '\n'.join(lines) + '\n', {
        'description': 'Comma separated, temperature in kelvin, current and voltage in A and V.',
        'method': 'four-point',
        'setup': {'wafer': {'thicknessCm': t}, 'lot': {}, 'station': {'probeSpacingCm': s, 'thermometer': 'thermocouple'}},
        'expect': {'delimiter': ',', 'decimalMark': '.', 'pointCount': 24, 'headerRow': 1,
                   'columns': [{'index': 0, 'meaning': 'temperature', 'unit': 'K'}, {'index': 1, 'meaning': 'current', 'unit': 'A'}, {'index': 2, 'meaning': 'voltage', 'unit': 'V'}],
                   'suggestedMethod': 'four-point',
                   'points': pick(points, {2, 13, 25}), 'relativeTolerance': 1e-6},
    })


# 2. semicolon, decimal comma, BOM, CRLF, degC, mA and mV, finite slice diameter from the lot.
def semicolon_celsius():
    s, t, d = 0.1587, 0.0675, 10.0
    lines = ['Probe station export;Rhotrace example', 'Operator;Ines Valdoria', 'T (°C);I (mA);U (mV)']
    points = []
    for k in range(18):
        celsius = -20 + k * 10
        i_ma = 4.53
        rho = rho_model(celsius + 273.15, 0.012)
        v_mv = noisy(rho / (t * thickness_factor(t, s)) * i_ma / 4.2)
        v_text = f'{v_mv:.4f}'
        rs, rho_calc = four_point(float(v_text) * 1e-3, i_ma * 1e-3, s, t, d)
        row = k + 4
        lines.append(f'{celsius:.1f};{i_ma:.2f};{v_text}'.replace('.', ','))
        points.append({'row': row, 'sequence': k + 1, 'temperatureK': celsius + 273.15, 'sheetResistanceOhmSq': rs, 'resistivityOhmCm': rho_calc, 'voltageV': float(v_text) * 1e-3, 'currentA': i_ma * 1e-3, 'flags': []})
    write('semicolon-decimal-comma-celsius.csv', '\n'.join(lines) + '\n', {
        'description': 'Semicolon separated with decimal commas, UTF-8 BOM, CRLF line ends, metadata lines, degC, mA and mV; the lot diameter applies the finite-slice correction.',
        'method': 'four-point',
        'setup': {'wafer': {'thicknessCm': t}, 'lot': {'diameterCm': d}, 'station': {'probeSpacingCm': s, 'thermometer': 'thermocouple'}},
        'expect': {'delimiter': ';', 'decimalMark': ',', 'pointCount': 18, 'headerRow': 3,
                   'metadata': {'Probe station export': 'Rhotrace example', 'Operator': 'Ines Valdoria'},
                   'columns': [{'index': 0, 'meaning': 'temperature', 'unit': 'degC'}, {'index': 1, 'meaning': 'current', 'unit': 'mA'}, {'index': 2, 'meaning': 'voltage', 'unit': 'mV'}],
                   'suggestedMethod': 'four-point',
                   'points': pick(points, {4, 10, 21}), 'relativeTolerance': 1e-6},
    }, bom=True, newline='\r\n')


# 3. tab separated, metadata header with thickness, spacing and a constant current, comments.
def tab_metadata():
    s, t, i = 0.1, 0.038, 100e-6
    lines = ['# Rhotrace example export, invented readings', 'Sample: DEMO-W03', 'Thickness: 380 um',
             'Probe spacing: 1.0 mm', 'Current: 100 uA', '', 'T [K]\tV [mV]']
    points = []
    row = len(lines)
    seq = 0
    for k in range(20):
        temp = 300 + k * 10
        v_mv = noisy(rho_model(temp, 2.5) / (t * thickness_factor(t, s)) * i / (math.pi / math.log(2)) * 1e3)
        v_text = f'{v_mv:.5f}'
        if k == 10:
            lines.append('')
            lines.append('# chuck settled, continuing')
            row += 2
        lines.append(f'{temp}\t{v_text}')
        row += 1
        seq += 1
        rs, rho_calc = four_point(float(v_text) * 1e-3, i, s, t)
        points.append({'row': row, 'sequence': seq, 'temperatureK': temp, 'sheetResistanceOhmSq': rs, 'resistivityOhmCm': rho_calc, 'currentA': i, 'flags': []})
    write('tab-metadata-header.txt', '\n'.join(lines) + '\n', {
        'description': 'Tab separated, metadata lines give thickness, probe spacing and the constant source current; blank and comment lines inside the data.',
        'method': 'four-point',
        'setup': {'wafer': {}, 'lot': {}, 'station': None},
        'expect': {'delimiter': '\t', 'decimalMark': '.', 'pointCount': 20, 'headerRow': 7,
                   'metadata': {'Sample': 'DEMO-W03', 'Thickness': '380 um', 'Probe spacing': '1.0 mm', 'Current': '100 uA'},
                   'columns': [{'index': 0, 'meaning': 'temperature', 'unit': 'K'}, {'index': 1, 'meaning': 'voltage', 'unit': 'mV'}],
                   'suggestedMethod': 'four-point',
                   'points': pick(points, {8, 18, 21, 29}), 'relativeTolerance': 1e-6},
    })


# 4. temperature as Pt100 RTD ohms, resistance V/I in kilo-ohms.
def rtd_kohm():
    s, t, r0 = 0.127, 0.05, 100.0
    lines = ['Point,RTD (Ω),R [kΩ]']
    points = []
    for k in range(16):
        celsius = 5 + k * 15
        r_rtd = f'{rtd_ohm(celsius, r0):.4f}'
        r_k = noisy(rho_model(celsius + 273.15, 150.0) / (t * thickness_factor(t, s)) / (math.pi / math.log(2)) / 1e3)
        r_text = f'{r_k:.5f}'
        temp_k = rtd_celsius(float(r_rtd), r0) + 273.15
        rs, rho_calc = four_point(float(r_text) * 1e3, 1.0, s, t)
        row = k + 2
        lines.append(f'{k + 1},{r_rtd},{r_text}')
        points.append({'row': row, 'sequence': k + 1, 'temperatureK': temp_k, 'sheetResistanceOhmSq': rs, 'resistivityOhmCm': rho_calc, 'resistanceOhm': float(r_text) * 1e3, 'flags': []})
    write('rtd-ohms-kilohm.csv', '\n'.join(lines) + '\n', {
        'description': 'Temperature as Pt100 RTD resistance (IEC 60751 with the station R0), four-point V/I given as resistance in kilo-ohms.',
        'method': 'four-point',
        'setup': {'wafer': {'thicknessCm': t}, 'lot': {}, 'station': {'probeSpacingCm': s, 'thermometer': 'platinum-rtd', 'rtdR0Ohm': r0}},
        'expect': {'delimiter': ',', 'decimalMark': '.', 'pointCount': 16, 'headerRow': 1,
                   'columns': [{'index': 0, 'meaning': 'index', 'unit': None}, {'index': 1, 'meaning': 'temperature', 'unit': 'ohm'}, {'index': 2, 'meaning': 'resistance', 'unit': 'kohm'}],
                   'suggestedMethod': 'four-point',
                   'points': pick(points, {2, 9, 17}), 'relativeTolerance': 1e-6},
    })


# 5. two current levels per temperature, kept as separate points.
def two_levels():
    s, t = 0.1, 0.05
    lines = ['"T (K)","I set (mA)","I (mA)","V (mV)"']
    points = []
    row = 1
    seq = 0
    for k in range(12):
        temp = 200 + k * 25
        for level in (0.5, 2.0):
            v_mv = noisy(rho_model(temp, 4.0) / (t * thickness_factor(t, s)) * level / (math.pi / math.log(2)))
            i_meas = noisy(level, 0.0005)
            i_text, v_text = f'{i_meas:.4f}', f'{v_mv:.4f}'
            row += 1
            seq += 1
            rs, rho_calc = four_point(float(v_text) * 1e-3, float(i_text) * 1e-3, s, t)
            lines.append(f'{temp},{level},{i_text},{v_text}')
            points.append({'row': row, 'sequence': seq, 'temperatureK': temp, 'sheetResistanceOhmSq': rs, 'resistivityOhmCm': rho_calc, 'currentA': float(i_text) * 1e-3, 'flags': []})
    write('two-current-levels.csv', '\n'.join(lines) + '\n', {
        'description': 'Two source current levels at every temperature (quoted header cells); each reading is its own point.',
        'method': 'four-point',
        'setup': {'wafer': {'thicknessCm': t}, 'lot': {}, 'station': {'probeSpacingCm': s, 'thermometer': 'thermocouple'}},
        'expect': {'delimiter': ',', 'decimalMark': '.', 'pointCount': 24, 'headerRow': 1,
                   'columns': [{'index': 0, 'meaning': 'temperature', 'unit': 'K'}, {'index': 1, 'meaning': 'current-level', 'unit': 'mA'}, {'index': 2, 'meaning': 'current', 'unit': 'mA'}, {'index': 3, 'meaning': 'voltage', 'unit': 'mV'}],
                   'suggestedMethod': 'four-point',
                   'points': pick(points, {2, 3, 25}), 'relativeTolerance': 1e-6},
    })


# 6. forward and reverse polarity with a thermal EMF offset; each pair is one averaged point.
def polarity():
    s, t = 0.1, 0.05
    lines = ['Temp (K),Polarity,I (uA),V (uV)']
    points = []
    row = 1
    for k in range(14):
        temp = 100 + k * 20
        i = 50.0
        v_true = noisy(rho_model(temp, 0.8) / (t * thickness_factor(t, s)) * i / (math.pi / math.log(2)))
        emf = 35.0 + k
        vf, vr = f'{v_true + emf:.3f}', f'{-v_true + emf:.3f}'
        lines.append(f'{temp},+,{i:.1f},{vf}')
        lines.append(f'{temp},-,{i:.1f},{vr}')
        row += 2
        v = (float(vf) - float(vr)) / 2 * 1e-6
        rs, rho_calc = four_point(v, i * 1e-6, s, t)
        # the offset makes forward and reverse differ by |R+ - R-| / R, flagged above 2 %
        r_fwd, r_rev, r_avg = float(vf) / i, float(vr) / -i, v / (i * 1e-6)
        asymmetric = abs(r_fwd - r_rev) / r_avg > 0.02
        flags = ['polarity-averaged'] + (['polarity-asymmetry'] if asymmetric else [])
        points.append({'row': row - 1, 'sequence': k + 1, 'temperatureK': temp, 'sheetResistanceOhmSq': rs, 'resistivityOhmCm': rho_calc, 'voltageV': v, 'currentA': i * 1e-6, 'flags': flags})
    write('forward-reverse-polarity.csv', '\n'.join(lines) + '\n', {
        'description': 'Forward and reverse current at each temperature (polarity column, current given as a magnitude) with a thermoelectric offset that the average cancels; the readings differ by far more than 2 %, so each point is flagged polarity-asymmetry.',
        'method': 'four-point',
        'setup': {'wafer': {'thicknessCm': t}, 'lot': {}, 'station': {'probeSpacingCm': s, 'thermometer': 'thermocouple'}},
        'expect': {'delimiter': ',', 'decimalMark': '.', 'pointCount': 14, 'headerRow': 1,
                   'columns': [{'index': 0, 'meaning': 'temperature', 'unit': 'K'}, {'index': 1, 'meaning': 'polarity', 'unit': None}, {'index': 2, 'meaning': 'current', 'unit': 'uA'}, {'index': 3, 'meaning': 'voltage', 'unit': 'uV'}],
                   'suggestedMethod': 'four-point',
                   'points': pick(points, {2, 14, 28}), 'relativeTolerance': 1e-6},
    })


# 7. van der Pauw with key,value metadata lines and quoted cells.
def vdp():
    t = 0.035
    lines = ['Method,van der Pauw', 'Sample,"DEMO-SQ-2, corner contacts"', '', 'T_K,R_A (ohm),R_B (ohm)']
    points = []
    for k in range(15):
        temp = 150 + k * 20
        rs_true = rho_model(temp, 1.5) / t
        ra = noisy(rs_true / 4.532 * 1.3)
        rb = noisy(rs_true / 4.532 * 0.75)
        ra_t, rb_t = f'{ra:.5f}', f'{rb:.5f}'
        rs = van_der_pauw(float(ra_t), float(rb_t))
        row = k + 5
        lines.append(f'{temp},"{ra_t}",{rb_t}')
        points.append({'row': row, 'sequence': k + 1, 'temperatureK': temp, 'sheetResistanceOhmSq': rs, 'resistivityOhmCm': rs * t, 'flags': []})
    write('van-der-pauw-quoted.csv', '\n'.join(lines) + '\n', {
        'description': 'Van der Pauw R_A and R_B with key,value metadata lines and quoted cells; the equation is solved for each point.',
        'method': 'van-der-pauw',
        'setup': {'wafer': {'thicknessCm': t}, 'lot': {}, 'station': None},
        'expect': {'delimiter': ',', 'decimalMark': '.', 'pointCount': 15, 'headerRow': 4,
                   'metadata': {'Method': 'van der Pauw', 'Sample': 'DEMO-SQ-2, corner contacts'},
                   'columns': [{'index': 0, 'meaning': 'temperature', 'unit': 'K'}, {'index': 1, 'meaning': 'resistance', 'unit': 'ohm'}, {'index': 2, 'meaning': 'resistance-b', 'unit': 'ohm'}],
                   'suggestedMethod': 'van-der-pauw',
                   'points': pick(points, {5, 12, 19}), 'relativeTolerance': 1e-6},
    })


# 8. a metal film given as sheet resistance in ohm per square (Latin-1 file, degC).
def metal_sheet():
    t = 2.0e-5
    lines = ['Film;tungsten test wafer', 'Temperatur [°C];Rs [ohm/sq]']
    points = []
    for k in range(21):
        celsius = 20 + k * 10
        rs = noisy(2.75 * (1 + 0.0045 * (celsius - 20)), 0.0005)
        rs_text = f'{rs:.5f}'
        row = k + 3
        lines.append(f'{celsius:.1f};{rs_text}'.replace('.', ','))
        points.append({'row': row, 'sequence': k + 1, 'temperatureK': celsius + 273.15, 'sheetResistanceOhmSq': float(rs_text), 'resistivityOhmCm': float(rs_text) * t, 'flags': []})
    write('metal-film-sheet-latin1.csv', '\n'.join(lines) + '\n', {
        'description': 'Metal film sheet resistance in ohm/sq, semicolon and decimal comma, degC, written in Latin-1 (the degree sign is one byte).',
        'method': 'sheet-resistance',
        'setup': {'wafer': {'thicknessCm': t}, 'lot': {}, 'station': None},
        'expect': {'delimiter': ';', 'decimalMark': ',', 'pointCount': 21, 'headerRow': 2,
                   'metadata': {'Film': 'tungsten test wafer'},
                   'columns': [{'index': 0, 'meaning': 'temperature', 'unit': 'degC'}, {'index': 1, 'meaning': 'sheet-resistance', 'unit': 'ohm/sq'}],
                   'suggestedMethod': 'sheet-resistance',
                   'points': pick(points, {3, 13, 23}), 'relativeTolerance': 1e-9},
    }, encoding='latin-1')


if __name__ == '__main__':
    for make in (comma_kelvin, semicolon_celsius, tab_metadata, rtd_kohm, two_levels, polarity, vdp, metal_sheet):
        make()
