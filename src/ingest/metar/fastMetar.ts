/**
 * Single-pass decoder for the common shape of a METAR/SPECI line (WMO-No. 306 FM 15/16 body, FMH-1
 * ch. 12 remarks). It walks the line once with charCodeAt, without a token array, and decodes the usual
 * groups the same way decodeInto does (lite mode). Any group or form it does not handle makes it give up
 * (return false): the caller then decodes the whole line with decodeInto, so results are the same.
 */
import { WX } from '../types.js';
import { reportTimeMs } from './calendar.js';
import {
  digits,
  dg,
  internStation,
  isWord,
  pressureGroup,
  resetReport,
  skyGroup,
  statuteMiles,
  tempGroup,
  windGroup,
  type DecodeRef,
  type MetarReport,
} from './decodeMetar.js';
import { beginEnd, peakWind, signedTenths } from './remarks.js';
import { INCH_MM, INHG_HPA, KNOT_MS, STATUTE_MILE_M } from './units.js';
import { weatherFlags } from './weather.js';

const k3w = (w: string) => (w.charCodeAt(0) << 16) | (w.charCodeAt(1) << 8) | w.charCodeAt(2);
const K_RMK = k3w('RMK');
const K_FEW = k3w('FEW');
const K_SCT = k3w('SCT');
const K_BKN = k3w('BKN');
const K_OVC = k3w('OVC');

/**
 * Decode s[start, end) (no character below 32 other than spaces in it) into `r` as
 * `decodeInto(r, s, start, end, ref, true)` would, for reports without issues, unknown groups,
 * NIL, observer remarks or rare group forms. Returns false when it cannot vouch for the result
 * (r is then partly written: decode the line again with decodeInto).
 */
export function fastDecodeInto(r: MetarReport, s: string, start: number, end: number, ref: DecodeRef): boolean {
  resetReport(r);
  let p = start;
  // phase: 0 first token, 1 after METAR/SPECI, 2 after COR (station next), 3 time next, 4 body, 5 trend, 6 remarks
  let phase = 0;
  let visSet = false;
  let whole = -1; // pending whole statute miles (`1 1/2SM`)
  let pk = 0; // remarks: 1 after PK, 2 inside PK WND values
  let last = false;
  while (p < end && !last) {
    if (s.charCodeAt(p) === 32) {
      p++;
      continue;
    }
    const a = p;
    p = s.indexOf(' ', a + 1);
    if (p < 0 || p > end) p = end;
    let b = p;
    if (s.charCodeAt(b - 1) === 61 /* = */) {
      b--;
      last = true;
      if (b === a) break;
    }
    const len = b - a;
    const c0 = s.charCodeAt(a);
    if (phase === 6) {
      // ---- remarks (decodeRemarks order; `numeric` never turns on here: VIS/CIG/GR/SNINCR give up)
      if (pk === 1) {
        if (!isWord(s, a, b, 'WND')) return false;
        pk = 2;
        continue;
      }
      if (pk === 2) {
        if (peakWind(s, a, b, r)) continue;
        pk = 0;
      }
      if (c0 >= 48 && c0 <= 57) {
        if (len !== 5) return false;
        if (c0 === 49 || c0 === 50) {
          const v = signedTenths(s, a + 1);
          if (v !== v) return false;
          if (c0 === 49) r.tempMax6hC = v;
          else r.tempMin6hC = v;
          continue;
        }
        if (c0 === 53) {
          const code = dg(s, a + 1);
          const ppp = digits(s, a + 2, b);
          if (code >= 0 && code <= 8 && ppp >= 0) {
            const v = ppp / 10;
            r.pressureTendencyCode = code;
            r.pressureTendency3hHpa = code === 4 ? 0 : code <= 3 ? v : v === 0 ? 0 : -v;
            continue;
          }
        }
        return false;
      }
      switch (c0) {
        case 65: // AO1 AO2
          if (len === 3 && s.charCodeAt(a + 1) === 79) {
            const c2 = s.charCodeAt(a + 2);
            if (c2 === 50) r.stationType = 'AO2';
            else if (c2 === 49) r.stationType = 'AO1';
            else return false;
            continue;
          }
          return false;
        case 83: // SLPppp
          if (len === 6 && s.charCodeAt(a + 1) === 76 && s.charCodeAt(a + 2) === 80) {
            const ppp = digits(s, a + 3, b);
            if (ppp >= 0) {
              r.seaLevelPressureHpa = ppp >= 500 ? 900 + ppp / 10 : 1000 + ppp / 10;
              continue;
            }
            return false;
          }
          if (isWord(s, a, b, 'SNINCR')) return false;
          break;
        case 84: // TsnTTTsnTTT
          if ((len === 9 || len === 5) && dg(s, a + 1) >= 0) {
            const t = signedTenths(s, a + 1);
            const td = len === 9 ? signedTenths(s, a + 5) : NaN;
            if (t === t && (len === 5 || td === td)) {
              r.temperatureC = t;
              if (len === 9) r.dewpointC = td;
              r.tempFromRemarks = true;
              continue;
            }
          }
          break;
        case 80: // Prrrr, PK WND, PRESRR/PRESFR
          if (len === 5) {
            const v = digits(s, a + 1, b);
            if (v >= 0) {
              r.precip1hMm = (v * (INCH_MM * 10)) / 1000;
              r.precipTrace = v === 0;
              continue;
            }
            return false;
          }
          if (len === 2 && s.charCodeAt(a + 1) === 75) {
            pk = 1;
            continue;
          }
          if (isWord(s, a, b, 'PRESRR')) {
            r.pressureTrend = 1;
            continue;
          }
          if (isWord(s, a, b, 'PRESFR')) {
            r.pressureTrend = -1;
            continue;
          }
          break;
        case 36: // $
          if (len === 1) {
            r.maintenance = true;
            continue;
          }
          break;
        case 76: // LTG...
          if (len >= 3 && s.charCodeAt(a + 1) === 84 && s.charCodeAt(a + 2) === 71) {
            r.weather |= WX.CONVECTIVE;
            continue;
          }
          break;
        case 82: // RWYnn
          if (len >= 5 && s.startsWith('RWY', a) && dg(s, a + 3) >= 0) continue;
          break;
        case 87: case 67: case 70: case 86: case 71: case 73:
          return false; // WSHFT, WRM/COLD FROPA, CIG, CB, FROPA, VIS, GR, I-groups: the general decoder
      }
      // plain language: only begin/end times here
      if (beginEnd(s, a, b)) continue;
      return false;
    }
    if (phase >= 4) {
      // ---- body
      if (whole >= 0) {
        if (!(s.charCodeAt(b - 1) === 77 && s.charCodeAt(b - 2) === 83)) return false;
        const frac = statuteMiles(s, a, b);
        if (!(frac < 1)) return false;
        r.visibilityM = (whole + frac) * STATUTE_MILE_M;
        visSet = true;
        whole = -1;
        continue;
      }
      if (len === 3 && c0 === 82 && ((c0 << 16) | (s.charCodeAt(a + 1) << 8) | s.charCodeAt(a + 2)) === K_RMK) {
        phase = 6;
        continue;
      }
      if (phase === 5) continue;
      const cl = s.charCodeAt(b - 1);
      if (c0 >= 48 && c0 <= 57) {
        if (cl === 84 && (len === 7 || len === 10) && s.charCodeAt(b - 2) === 75) {
          // dddffKT / dddffGggKT, all digits (else windGroup below)
          const d = dg(s, a) * 100 + dg(s, a + 1) * 10 + dg(s, a + 2);
          const speed = dg(s, a + 3) * 10 + dg(s, a + 4);
          let gust = 0;
          if (len === 10) gust = s.charCodeAt(a + 5) === 71 ? dg(s, a + 6) * 10 + dg(s, a + 7) : -1;
          if (d >= 0 && d <= 360 && speed >= 0 && gust >= 0) {
            r.windDirDeg = speed === 0 && d === 0 ? 0 : d;
            r.windSpeedMs = speed * KNOT_MS;
            r.gustMs = len === 10 ? gust * KNOT_MS : NaN;
            r.windVariable = false;
            continue;
          }
        }
        if (cl === 84 || cl === 83 || cl === 72) {
          if (windGroup(s, a, b, r)) continue;
          return false;
        }
        if (cl === 77 && s.charCodeAt(b - 2) === 83) {
          // 10SM, 1/4SM (never a 4-digit visibility with compass suffix nor a dddVddd group)
          const miles = statuteMiles(s, a, b);
          if (miles !== miles) return false;
          r.visibilityM = miles * STATUTE_MILE_M;
          visSet = true;
          continue;
        }
        if (len === 4) {
          const v = digits(s, a, b);
          if (v < 0) return false;
          if (!visSet) {
            r.visibilityM = v === 9999 ? 10000 : v;
            visSet = true;
          }
          continue;
        }
        if (len === 7) {
          if (s.charCodeAt(a + 3) !== 86) return false;
          const x = digits(s, a, a + 3);
          const y = digits(s, a + 4, b);
          if (x >= 0 && y >= 0 && x <= 360 && y <= 360) {
            r.windVarFromDeg = x;
            r.windVarToDeg = y;
            continue;
          }
          return false;
        }
        if (len > 7) return false;
        if (len <= 2) {
          whole = digits(s, a, b);
          if (whole < 0 || last) return false;
          continue;
        }
        if (len === 5 && s.charCodeAt(a + 2) === 47) {
          // dd/dd
          const t = dg(s, a) * 10 + dg(s, a + 1);
          const td = dg(s, a + 3) * 10 + dg(s, a + 4);
          if (t >= 0 && td >= 0) {
            r.temperatureC = t;
            r.dewpointC = td;
            continue;
          }
        }
        if ((len === 5 || len === 6) && s.charCodeAt(a + 2) === 47 && tempGroup(s, a, b, r)) continue;
        return false;
      }
      if (len === 6) {
        // FEWhhh SCThhh BKNhhh OVChhh: nothing to keep in lite mode
        const k = (c0 << 16) | (s.charCodeAt(a + 1) << 8) | s.charCodeAt(a + 2);
        if ((k === K_FEW || k === K_SCT || k === K_BKN || k === K_OVC) && dg(s, a + 3) + dg(s, a + 4) + dg(s, a + 5) >= 0) continue;
      } else if (len === 5 && c0 === 65) {
        const v = digits(s, a + 1, b);
        if (v >= 0) {
          r.altimeterHpa = (v / 100) * INHG_HPA;
          continue;
        }
      }
      switch (c0) {
        case 77: // M05/M07 (M1/4SM: general decoder)
          if (cl === 77 && s.charCodeAt(b - 2) === 83) return false;
          if (tempGroup(s, a, b, r)) continue;
          break;
        case 80: // P6SM
          if (cl === 77 && s.charCodeAt(b - 2) === 83) {
            const miles = statuteMiles(s, a, b);
            if (miles === miles) {
              r.visibilityM = miles * STATUTE_MILE_M;
              visSet = true;
              continue;
            }
          }
          break;
        case 47:
          return false;
        case 86: // VRB wind, VV sky
          if (windGroup(s, a, b, r)) continue;
          break;
        case 67: // CAVOK
          if (isWord(s, a, b, 'CAVOK')) {
            r.cavok = true;
            r.visibilityM = 10000;
            visSet = true;
            continue;
          }
          if (isWord(s, a, b, 'COR') || (len === 3 && s.charCodeAt(a + 1) === 67)) return false;
          break;
        case 65: // AUTO, Ahhhh
          if (isWord(s, a, b, 'AUTO')) {
            r.auto = true;
            continue;
          }
          if (pressureGroup(s, a, b, r)) continue;
          if (len >= 3 && s.charCodeAt(a + 1) === 79) return false;
          break;
        case 81: // Qhhhh
          if (pressureGroup(s, a, b, r)) continue;
          break;
        case 78: // NIL (general decoder), NOSIG
          if (isWord(s, a, b, 'NOSIG')) continue;
          if (isWord(s, a, b, 'NIL')) return false;
          break;
        case 82: // RVR (not kept in lite mode), RE weather
          if (len >= 5 && dg(s, a + 1) >= 0 && s.indexOf('/', a) < b && s.indexOf('/', a) > 0) continue;
          if (len >= 4 && s.charCodeAt(a + 1) === 69) return false;
          break;
        case 84: // TEMPO
        case 66: // BECMG
          if (isWord(s, a, b, 'BECMG') || isWord(s, a, b, 'TEMPO')) {
            phase = 5;
            continue;
          }
          break;
        case 87:
          return false;
        case 83:
          if (len >= 5 && s.charCodeAt(a + 1) === 76 && s.charCodeAt(a + 2) === 80) return false;
          break;
        case 36:
          if (len === 1) {
            r.maintenance = true;
            continue;
          }
          break;
      }
      if (skyGroup(s, a, b, r, true)) continue;
      const wf = weatherFlags(s, a, b);
      if (wf >= 0) {
        r.weather |= wf;
        continue;
      }
      return false;
    }
    // ---- header
    if (phase === 0) {
      if (len === 5 && (c0 === 77 || c0 === 83)) {
        if (isWord(s, a, b, 'METAR')) {
          phase = 1;
          continue;
        }
        if (isWord(s, a, b, 'SPECI')) {
          r.type = 'SPECI';
          phase = 1;
          continue;
        }
      }
      phase = 1;
    }
    if (phase === 1) {
      if (len === 3 && isWord(s, a, b, 'COR')) {
        r.corrected = true;
        phase = 2;
        continue;
      }
      phase = 2;
    }
    if (phase === 2) {
      if (len < 3 || len > 5 || c0 < 65 || c0 > 90) return false;
      let key = c0 - 54;
      for (let k = a + 1; k < b; k++) {
        const q = s.charCodeAt(k);
        if (q >= 65 && q <= 90) key = key * 37 + (q - 54);
        else if (q >= 48 && q <= 57) key = key * 37 + (q - 47);
        else return false;
      }
      r.station = internStation(s, a, b, key);
      phase = 3;
      continue;
    }
    // phase 3: DDHHMMZ
    if (!((len === 7 && s.charCodeAt(a + 6) === 90) || len === 6)) return false;
    const day = dg(s, a) * 10 + dg(s, a + 1);
    const hh = dg(s, a + 2) * 10 + dg(s, a + 3);
    const mm = dg(s, a + 4) * 10 + dg(s, a + 5);
    if (day < 1 || day > 31 || hh < 0 || hh > 24 || mm < 0 || mm > 59 || (hh === 24 && mm !== 0)) return false;
    const t = reportTimeMs(day, hh, mm, ref);
    if (t !== t) return false;
    r.timeMs = t;
    phase = 4;
  }
  return phase >= 4 && whole < 0 && pk !== 1;
}
