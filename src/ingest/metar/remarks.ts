/**
 * US remarks section of METAR/SPECI (after `RMK`), per FMH-1 ch. 12 §12.7 (automated, manual and plain
 * language remarks; additive and maintenance data). Decoded by char codes; unknown groups are kept.
 */
import { WX, type ObserverRemark } from '../../model/index.js';
import { unknown, type MetarReport } from './metarReport.js';
import { beginEnd, dg, digits, hhmm, isWord, peakWind, remarkTimeMs, signedTenths, slashes } from './groups.js';
import { INCH_MM } from '../../physics/constants.js';
import { weatherFlagsAt } from './weather.js';
import { pressureChangeFromTendencyHpa } from '../../physics/pressure.js';

const COMPASS = new Set(['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW', 'NNE', 'ENE', 'ESE', 'SSE', 'SSW', 'WSW', 'WNW', 'NNW', 'OHD', 'ALQDS']);

/** Direction or direction range in plain-language remarks: `W`, `SW-NW`, `OHD-S` (FMH-1 §12.7.1). */
function direction(word: string): boolean {
  if (COMPASS.has(word)) return true;
  const k = word.indexOf('-');
  if (k < 0) return false;
  for (const part of word.split('-')) if (!COMPASS.has(part)) return false;
  return true;
}

/**
 * Plain-language vocabulary of FMH-1 §12.7 remarks (location, movement, frequency, sensor status,
 * cloud and obscuration words). Recognised so that only truly unknown groups are counted.
 */
const VOCABULARY = new Set([
  'AND', 'DSNT', 'VC', 'MOV', 'MOVD', 'STNRY', 'OCNL', 'FRQ', 'CONS', 'VIRGA', 'TCU', 'ACC', 'ACSL', 'SFC', 'TWR',
  'V', 'RWY', 'PLUME', 'DRFTG', 'FIRST', 'LAST', 'NOSPECI', 'ESTMD', 'WND', 'DATA', 'BINOVC', 'BKN', 'OVC', 'SCT',
  'FEW', 'CLR', 'INTMT', 'LGT', 'MDT', 'HVY', 'FUNNEL', 'CLOUD', 'TORNADO', 'WATERSPOUT', 'THN', 'THK', 'HIR', 'LWR',
  'TOPS', 'TO', 'OF', 'AT', 'IN', 'MTNS', 'OBSC', 'OBSCD', 'MISG', 'NO', 'UNKN', 'SLPNO', 'TSNO', 'PNO', 'FZRANO',
  'RVRNO', 'PWINO', 'VISNO', 'CHINO', 'RVR', 'COR', 'ALSTG', 'AFT', 'BFR', 'PCPN', 'SNOW', 'ICE', 'LTGICG', 'HALO',
]);

/** Number-like remark values after VIS, CIG, GR, SNINCR: `2`, `1/2`, `3/4V1`, `013V017`, `M1/4`, `P6`. */
function numberLike(s: string, a: number, b: number): boolean {
  let i = a;
  const c = s.charCodeAt(i);
  if (c === 77 || c === 80) i++;
  if (i >= b) return false;
  for (; i < b; i++) {
    const q = s.charCodeAt(i);
    if (!((q >= 48 && q <= 57) || q === 47 || q === 86)) return false;
  }
  return true;
}

function observerRemark(r: MetarReport, label: string, frontal: boolean, shiftTimeMs: number, file: string, line: number): void {
  const o: ObserverRemark = { reportTimeMs: r.timeMs, label, frontal, shiftTimeMs, file, line };
  r.remarks.push(o);
}

/**
 * Decode remark tokens TS/TE[i0, n) of s (u: the same characters as bytes, see asciiView) into r. Groups (FMH-1 §12.7): AO1/AO2, SLPppp/SLPNO,
 * TsnTTTsnTTT, 1snTTT, 2snTTT, 4snTTTsnTTT, 5appp, 6RRRR, 7RRRR, Prrrr, PK WND, WSHFT [FROPA],
 * FROPA / WRM FROPA / APRNT FROPA, PRESRR/PRESFR, LTG…, begin/end times, sensor status (…NO),
 * `$`; plain-language words, directions and VIS/CIG values are recognised; everything else is kept
 * in r.unknownGroups.
 */
export function decodeRemarks(
  s: string,
  u: Uint8Array,
  TS: Int32Array,
  TE: Int32Array,
  i0: number,
  n: number,
  r: MetarReport,
  file: string,
  line: number,
  _lite: boolean,
): void {
  let numeric = false; // inside VIS / CIG / GR / SNINCR values
  for (let i = i0; i < n; i++) {
    const a = TS[i]!;
    const b = TE[i]!;
    const len = b - a;
    const c0 = s.charCodeAt(a);
    if (c0 >= 48 && c0 <= 57) {
      // additive data groups (FMH-1 §12.7.2)
      if (len === 5 && s.charCodeAt(a + 1) === 47 && (c0 === 52 || c0 === 56) && digits(u, a + 2, b) >= 0) {
        continue; // 4/sss snow depth, 8/CLCMCH cloud types
      }
      if (len === 5) {
        const rest = digits(u, a + 1, b);
        const miss = rest < 0 && slashes(u, a + 1, b);
        if (c0 === 49 /* 1 */ || c0 === 50 /* 2 */) {
          if (miss) continue;
          const v = signedTenths(u, a + 1);
          if (!Number.isNaN(v)) {
            if (c0 === 49) r.tempMax6hC = v;
            else r.tempMin6hC = v;
            numeric = false;
            continue;
          }
        } else if (c0 === 53 /* 5 */) {
          if (miss) continue;
          const code = dg(u, a + 1);
          const ppp = digits(u, a + 2, b);
          if (code >= 0 && code <= 8 && ppp >= 0) {
            r.pressureTendencyCode = code;
            r.pressureTendency3hHpa = pressureChangeFromTendencyHpa(code, ppp); // WMO-No. 306 code table 0200
            numeric = false;
            continue;
          }
        } else if (c0 === 54 /* 6 */ || c0 === 55 /* 7 */) {
          if (miss || rest >= 0) {
            const mm = miss ? NaN : (rest * (INCH_MM * 10)) / 1000;
            if (c0 === 54) r.precip3or6hMm = mm;
            else r.precip24hMm = mm;
            numeric = false;
            continue;
          }
        } else if (c0 === 57 /* 9 */ && s.charCodeAt(a + 1) === 56 && rest >= 0) continue; // 98mmm sunshine
      } else if (len === 9 && c0 === 52 /* 4 */) {
        // 24-h max/min 4snTxTxTxsnTnTnTn
        if (!Number.isNaN(signedTenths(u, a + 1)) && !Number.isNaN(signedTenths(u, a + 5))) continue;
      } else if (len === 6 && c0 === 57 && s.charCodeAt(a + 1) === 51 && digits(u, a, b) >= 0) {
        continue; // 931RRR / 933RRR snow
      }
      if (numeric && numberLike(s, a, b)) continue;
      unknown(r, s, a, b);
      continue;
    }
    switch (c0) {
      case 65: // A
        if ((len === 3 || len === 4) && s.charCodeAt(a + 1) === 79 && (s.charCodeAt(a + 2) === 49 || s.charCodeAt(a + 2) === 50)) {
          const two = s.charCodeAt(a + 2) === 50;
          r.stationType = len === 3 ? (two ? 'AO2' : 'AO1') : s.charCodeAt(a + 3) === 65 ? (two ? 'AO2A' : 'AO1A') : s.slice(a, b);
          continue;
        }
        if (isWord(u, a, b, 'APRNT') && i + 1 < n && isWord(u, TS[i + 1]!, TE[i + 1]!, 'FROPA')) {
          observerRemark(r, 'APRNT FROPA', true, NaN, file, line);
          i++;
          continue;
        }
        break;
      case 83: // S: SLPppp, SLPNO, SNINCR
        if (len === 6 && s.charCodeAt(a + 1) === 76 && s.charCodeAt(a + 2) === 80) {
          const ppp = digits(u, a + 3, b);
          if (ppp >= 0) {
            // FMH-1 §12.7.1(t): tens, units, tenths of hPa; decoding convention ≥ 500 → 9xx.x, else 10xx.x
            r.seaLevelPressureHpa = ppp >= 500 ? 900 + ppp / 10 : 1000 + ppp / 10;
            continue;
          }
          if (slashes(u, a + 3, b)) continue;
        }
        if (isWord(u, a, b, 'SNINCR')) {
          numeric = true;
          continue;
        }
        break;
      case 84: // T: TsnTTTsnTTT (or T + temperature only)
        if ((len === 9 || len === 5) && dg(u, a + 1) >= 0) {
          const t = signedTenths(u, a + 1);
          const td = len === 9 ? signedTenths(u, a + 5) : NaN;
          if (!Number.isNaN(t) && (len === 5 || !Number.isNaN(td))) {
            r.temperatureC = t;
            if (len === 9) r.dewpointC = td;
            r.tempFromRemarks = true;
            continue;
          }
        }
        break;
      case 80: // P: Prrrr, PK WND, PRESRR/PRESFR
        if (len === 5) {
          const v = digits(u, a + 1, b);
          if (v >= 0) {
            r.precip1hMm = (v * (INCH_MM * 10)) / 1000;
            r.precipTrace = v === 0;
            continue;
          }
          if (slashes(u, a + 1, b)) continue;
        }
        if (isWord(u, a, b, 'PK') && i + 1 < n && isWord(u, TS[i + 1]!, TE[i + 1]!, 'WND')) {
          i++;
          while (i + 1 < n && peakWind(u, TS[i + 1]!, TE[i + 1]!, r)) i++;
          continue;
        }
        if (isWord(u, a, b, 'PRESRR')) {
          r.pressureTrend = 1;
          continue;
        }
        if (isWord(u, a, b, 'PRESFR')) {
          r.pressureTrend = -1;
          continue;
        }
        break;
      case 87: // W: WSHFT (hh)mm [FROPA], WRM FROPA
        if (isWord(u, a, b, 'WSHFT')) {
          let t = NaN;
          if (i + 1 < n) {
            const tm = hhmm(u, TS[i + 1]!, TE[i + 1]!);
            if (tm) {
              t = remarkTimeMs(r.timeMs, tm[0], tm[1]);
              i++;
            }
          }
          if (i + 1 < n && isWord(u, TS[i + 1]!, TE[i + 1]!, 'FROPA')) {
            observerRemark(r, 'FROPA', true, t, file, line);
            i++;
          } else observerRemark(r, 'WSHFT', false, t, file, line);
          continue;
        }
        if (isWord(u, a, b, 'WRM') && i + 1 < n && isWord(u, TS[i + 1]!, TE[i + 1]!, 'FROPA')) {
          observerRemark(r, 'WRM FROPA', true, NaN, file, line);
          i++;
          continue;
        }
        break;
      case 67: // C: COLD FROPA, CIG, CB
        if (isWord(u, a, b, 'COLD') && i + 1 < n && isWord(u, TS[i + 1]!, TE[i + 1]!, 'FROPA')) {
          observerRemark(r, 'COLD FROPA', true, NaN, file, line);
          i++;
          continue;
        }
        if (isWord(u, a, b, 'CIG')) {
          numeric = true;
          continue;
        }
        if (isWord(u, a, b, 'CB') || isWord(u, a, b, 'CBMAM')) {
          r.weather |= WX.CONVECTIVE;
          continue;
        }
        break;
      case 70: // F: FROPA standing alone
        if (isWord(u, a, b, 'FROPA')) {
          observerRemark(r, 'FROPA', true, NaN, file, line);
          continue;
        }
        break;
      case 76: // L: lightning LTG, LTGIC, LTGCGIC, ...
        if (len >= 3 && s.charCodeAt(a + 1) === 84 && s.charCodeAt(a + 2) === 71) {
          r.weather |= WX.CONVECTIVE;
          continue;
        }
        break;
      case 86: // V: VIS
        if (isWord(u, a, b, 'VIS')) {
          numeric = true;
          continue;
        }
        break;
      case 71: // G: GR hail size
        if (isWord(u, a, b, 'GR')) {
          numeric = true;
          continue;
        }
        break;
      case 82: // R: RWYnn
        if (len >= 5 && s.startsWith('RWY', a) && dg(u, a + 3) >= 0) continue;
        break;
      case 73: // I: I1nnn, I3nnn, I6nnn ice accretion
        if (len === 5 && digits(u, a + 1, b) >= 0) continue;
        break;
      case 36: // $
        if (len === 1) {
          r.maintenance = true;
          continue;
        }
        break;
    }
    // Plain language.
    if (numeric && numberLike(s, a, b)) continue;
    if (beginEnd(u, a, b)) {
      numeric = false;
      continue;
    }
    const word = s.slice(a, b);
    if (VOCABULARY.has(word) || direction(word)) continue;
    if (weatherFlagsAt(u, a, b) >= 0) continue;
    if (len <= 6 && (word.startsWith('FEW') || word.startsWith('SCT') || word.startsWith('BKN') || word.startsWith('OVC')) && (len === 3 || digits(u, a + 3, b) >= 0)) continue;
    numeric = false;
    r.unknownGroups.push(word);
  }
}
