/**
 * Single-pass decoder for the common shape of a METAR/SPECI line, reading the file's bytes
 * (WMO-No. 306 FM 15/16 body, FMH-1 ch. 12 remarks). It walks the line once, without a token array or
 * substrings, and decodes the usual groups exactly as decodeInto does in lite mode. Any group or form it
 * does not handle, and any byte that is not printable ASCII or a blank, makes it give up (return false):
 * the caller then decodes that line as text with decodeInto, so results are the same either way
 * (test/ingest/metar-fastpath.test.ts checks it line by line). The group decoders are shared with the
 * general decoder (groups.ts).
 */
import { WX } from '../../model/index.js';
import { reportTimeMs } from './calendar.js';
import { isNotStationKey, knownStation, internStation, type DecodeRef } from './decodeMetar.js';
import { resetReport, type MetarReport } from './metarReport.js';
import {
  beginEnd,
  dg,
  digits,
  isWord,
  k3,
  kw,
  lowerCeiling,
  noCeiling,
  peakWind,
  pressureGroup,
  signedTenths,
  skyGroup,
  statuteMiles,
  tempGroup,
  windGroup,
} from './groups.js';
import { HPA_PER_INHG, INCH_MM, KNOT_MS, STATUTE_MILE_M } from '../../physics/constants.js';
import { weatherFlagsAt } from './weather.js';
import { pressureChangeFromTendencyHpa } from '../../physics/pressure.js';

const K_RMK = kw('RMK');
const K_FEW = kw('FEW');
const K_SCT = kw('SCT');
const K_BKN = kw('BKN');
const K_OVC = kw('OVC');
const K_MET = kw('MET');
const K_SPE = kw('SPE');
const K_COR = kw('COR');
const K_WND = kw('WND');
const K_NIL = kw('NIL');
const K_PRE = kw('PRE');
const K_RWY = kw('RWY');

/**
 * Decode u[start, end) into `r` as `decodeInto(r, text, …, ref, true)` would decode the same line as
 * text, for reports without issues, unknown groups, NIL, observer remarks or rare group forms; the
 * bytes between `start` and `end` must be blanks or printable ASCII (else false). Returns false when it
 * cannot vouch for the result (r is then partly written: decode the line again with decodeInto).
 */
export function decodeBytesInto(r: MetarReport, u: Uint8Array, start: number, end: number, ref: DecodeRef): boolean {
  resetReport(r);
  let p = start;
  // phase: 0 first token, 1 after METAR/SPECI, 2 after COR (station next), 3 time next, 4 body, 5 trend, 6 remarks
  let phase = 0;
  let visSet = false;
  let whole = -1; // pending whole statute miles (`1 1/2SM`)
  let pk = 0; // remarks: 1 after PK, 2 inside PK WND values
  while (p < end) {
    let c = u[p]!;
    if (c === 32) {
      p++;
      continue;
    }
    const a = p;
    // printable ASCII up to the next blank; anything else goes to the general decoder
    while (c > 32 && c < 127) {
      if (++p === end) break;
      c = u[p]!;
    }
    if (p < end && c !== 32) return false;
    let b = p;
    let last = false;
    if (u[b - 1] === 61 /* = */) {
      // end of report: only blanks may follow
      b--;
      last = true;
      while (p < end && u[p] === 32) p++;
      if (p < end) return false;
      if (b === a) break;
    }
    const len = b - a;
    const c0 = u[a]!;
    if (phase === 6) {
      // ---- remarks (decodeRemarks order; `numeric` never turns on here: VIS/CIG/GR/SNINCR give up)
      if (pk === 1) {
        if (!(len === 3 && k3(u, a) === K_WND)) return false;
        pk = 2;
        continue;
      }
      if (pk === 2) {
        if (peakWind(u, a, b, r)) continue;
        pk = 0;
      }
      if (c0 >= 48 && c0 <= 57) {
        if (len !== 5) return false;
        if (c0 === 49 || c0 === 50) {
          const v = signedTenths(u, a + 1);
          if (v !== v) return false;
          if (c0 === 49) r.tempMax6hC = v;
          else r.tempMin6hC = v;
          continue;
        }
        if (c0 === 53) {
          const code = dg(u, a + 1);
          const ppp = digits(u, a + 2, b);
          if (code >= 0 && code <= 8 && ppp >= 0) {
            r.pressureTendencyCode = code;
            r.pressureTendency3hHpa = pressureChangeFromTendencyHpa(code, ppp); // WMO-No. 306 code table 0200
            continue;
          }
        }
        return false;
      }
      switch (c0) {
        case 65: // AO1 AO2
          if (len === 3 && u[a + 1] === 79) {
            const c2 = u[a + 2];
            if (c2 === 50) r.stationType = 'AO2';
            else if (c2 === 49) r.stationType = 'AO1';
            else return false;
            continue;
          }
          return false;
        case 83: // SLPppp
          if (len === 6 && u[a + 1] === 76 && u[a + 2] === 80) {
            const ppp = digits(u, a + 3, b);
            if (ppp >= 0) {
              r.seaLevelPressureHpa = ppp >= 500 ? 900 + ppp / 10 : 1000 + ppp / 10;
              continue;
            }
            return false;
          }
          if (len === 6 && u[a + 1] === 78 && u[a + 2] === 73) return false; // SNINCR
          break;
        case 84: // TsnTTTsnTTT
          if ((len === 9 || len === 5) && dg(u, a + 1) >= 0) {
            const t = signedTenths(u, a + 1);
            const td = len === 9 ? signedTenths(u, a + 5) : NaN;
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
            const v = digits(u, a + 1, b);
            if (v >= 0) {
              r.precip1hMm = (v * (INCH_MM * 10)) / 1000;
              r.precipTrace = v === 0;
              continue;
            }
            return false;
          }
          if (len === 2 && u[a + 1] === 75) {
            pk = 1;
            continue;
          }
          if (len === 6 && k3(u, a) === K_PRE && u[a + 3] === 83 && u[a + 5] === 82) {
            const x = u[a + 4];
            if (x === 82) {
              r.pressureTrend = 1;
              continue;
            }
            if (x === 70) {
              r.pressureTrend = -1;
              continue;
            }
          }
          break;
        case 36: // $
          if (len === 1) {
            r.maintenance = true;
            continue;
          }
          break;
        case 76: // LTG...
          if (len >= 3 && u[a + 1] === 84 && u[a + 2] === 71) {
            r.weather |= WX.CONVECTIVE;
            continue;
          }
          break;
        case 82: // RWYnn
          if (len >= 5 && k3(u, a) === K_RWY && dg(u, a + 3) >= 0) continue;
          break;
        case 87: case 67: case 70: case 86: case 71: case 73:
          return false; // WSHFT, WRM/COLD FROPA, CIG, CB, FROPA, VIS, GR, I-groups: the general decoder
      }
      // plain language: only begin/end times here
      if (beginEnd(u, a, b)) continue;
      return false;
    }
    if (phase >= 4) {
      // ---- body
      if (whole >= 0) {
        if (!(u[b - 1] === 77 && u[b - 2] === 83)) return false;
        const frac = statuteMiles(u, a, b);
        if (!(frac < 1)) return false;
        r.visibilityM = (whole + frac) * STATUTE_MILE_M;
        visSet = true;
        whole = -1;
        continue;
      }
      if (len === 3 && c0 === 82 && k3(u, a) === K_RMK) {
        phase = 6;
        continue;
      }
      if (phase === 5) continue;
      const cl = u[b - 1];
      if (c0 >= 48 && c0 <= 57) {
        if (cl === 84 && (len === 7 || len === 10) && u[b - 2] === 75) {
          // dddffKT / dddffGggKT, all digits (else windGroup below)
          const d = dg(u, a) * 100 + dg(u, a + 1) * 10 + dg(u, a + 2);
          const speed = dg(u, a + 3) * 10 + dg(u, a + 4);
          let gust = 0;
          if (len === 10) gust = u[a + 5] === 71 ? dg(u, a + 6) * 10 + dg(u, a + 7) : -1;
          if (d >= 0 && d <= 360 && speed >= 0 && gust >= 0) {
            r.windDirDeg = speed === 0 && d === 0 ? 0 : d;
            r.windSpeedMs = speed * KNOT_MS;
            r.gustMs = len === 10 ? gust * KNOT_MS : NaN;
            r.windVariable = false;
            continue;
          }
        }
        if (cl === 84 || cl === 83 || cl === 72) {
          if (windGroup(u, a, b, r)) continue;
          return false;
        }
        if (cl === 77 && u[b - 2] === 83) {
          // 10SM, 1/4SM (never a 4-digit visibility with compass suffix nor a dddVddd group)
          const miles = statuteMiles(u, a, b);
          if (miles !== miles) return false;
          r.visibilityM = miles * STATUTE_MILE_M;
          visSet = true;
          continue;
        }
        if (len === 4) {
          const v = digits(u, a, b);
          if (v < 0) return false;
          if (!visSet) {
            r.visibilityM = v === 9999 ? 10000 : v;
            visSet = true;
          }
          continue;
        }
        if (len === 7) {
          if (u[a + 3] !== 86) return false;
          const x = digits(u, a, a + 3);
          const y = digits(u, a + 4, b);
          if (x >= 0 && y >= 0 && x <= 360 && y <= 360) {
            r.windVarFromDeg = x;
            r.windVarToDeg = y;
            continue;
          }
          return false;
        }
        if (len > 7) return false;
        if (len <= 2) {
          whole = digits(u, a, b);
          if (whole < 0 || last) return false;
          continue;
        }
        if (len === 5 && u[a + 2] === 47) {
          // dd/dd
          const t = dg(u, a) * 10 + dg(u, a + 1);
          const td = dg(u, a + 3) * 10 + dg(u, a + 4);
          if (t >= 0 && td >= 0) {
            r.temperatureC = t;
            r.dewpointC = td;
            continue;
          }
        }
        if ((len === 5 || len === 6) && u[a + 2] === 47 && tempGroup(u, a, b, r)) continue;
        return false;
      }
      if (len === 6) {
        // FEWhhh SCThhh BKNhhh OVChhh: only the ceiling (BKN, OVC) is kept in lite mode
        const k = k3(u, a);
        const d3 = dg(u, a + 3);
        const d4 = dg(u, a + 4);
        const d5 = dg(u, a + 5);
        if ((k === K_FEW || k === K_SCT || k === K_BKN || k === K_OVC) && d3 + d4 + d5 >= 0) {
          if (k === K_BKN || k === K_OVC) lowerCeiling(r, (d3 * 100 + d4 * 10 + d5) * 100);
          else noCeiling(r);
          continue;
        }
      } else if (len === 5 && c0 === 65) {
        const v = digits(u, a + 1, b);
        if (v >= 0) {
          r.altimeterHpa = (v / 100) * HPA_PER_INHG;
          continue;
        }
      }
      switch (c0) {
        case 77: // M05/M07 (M1/4SM: general decoder)
          if (cl === 77 && u[b - 2] === 83) return false;
          if (tempGroup(u, a, b, r)) continue;
          break;
        case 80: // P6SM
          if (cl === 77 && u[b - 2] === 83) {
            const miles = statuteMiles(u, a, b);
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
          if (windGroup(u, a, b, r)) continue;
          break;
        case 67: // CAVOK
          if (isWord(u, a, b, 'CAVOK')) {
            r.cavok = true;
            r.visibilityM = 10000;
            noCeiling(r);
            visSet = true;
            continue;
          }
          if (len === 3 && (k3(u, a) === K_COR || u[a + 1] === 67)) return false;
          break;
        case 65: // AUTO, Ahhhh
          if (isWord(u, a, b, 'AUTO')) {
            r.auto = true;
            continue;
          }
          if (pressureGroup(u, a, b, r)) continue;
          if (len >= 3 && u[a + 1] === 79) return false;
          break;
        case 81: // Qhhhh
          if (pressureGroup(u, a, b, r)) continue;
          break;
        case 78: // NIL (general decoder), NOSIG
          if (isWord(u, a, b, 'NOSIG')) continue;
          if (len === 3 && k3(u, a) === K_NIL) return false;
          break;
        case 82: {
          // RVR (not kept in lite mode), RE weather
          if (len >= 5 && dg(u, a + 1) >= 0) {
            let k = a + 2;
            while (k < b && u[k] !== 47) k++;
            if (k < b) continue;
          }
          if (len >= 4 && u[a + 1] === 69) return false;
          break;
        }
        case 84: // TEMPO
        case 66: // BECMG
          if (isWord(u, a, b, 'BECMG') || isWord(u, a, b, 'TEMPO')) {
            phase = 5;
            continue;
          }
          break;
        case 87:
          return false;
        case 83:
          if (len >= 5 && u[a + 1] === 76 && u[a + 2] === 80) return false;
          break;
        case 36:
          if (len === 1) {
            r.maintenance = true;
            continue;
          }
          break;
      }
      if (skyGroup(u, a, b, r, true)) continue;
      const wf = weatherFlagsAt(u, a, b);
      if (wf >= 0) {
        r.weather |= wf;
        continue;
      }
      return false;
    }
    // ---- header
    if (phase === 0) {
      if (len === 5) {
        const k = k3(u, a);
        if (k === K_MET && u[a + 3] === 65 && u[a + 4] === 82) {
          phase = 1;
          continue;
        }
        if (k === K_SPE && u[a + 3] === 67 && u[a + 4] === 73) {
          r.type = 'SPECI';
          phase = 1;
          continue;
        }
      }
      phase = 1;
    }
    if (phase === 1) {
      if (len === 3 && k3(u, a) === K_COR) {
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
        const q = u[k]!;
        if (q >= 65 && q <= 90) key = key * 37 + (q - 54);
        else if (q >= 48 && q <= 57) key = key * 37 + (q - 47);
        else return false;
      }
      const known = knownStation(key);
      if (known === undefined && isNotStationKey(key)) return false; // a code word, not a station: the general decoder says why
      r.station = known ?? internStation(String.fromCharCode.apply(null, u.subarray(a, b) as unknown as number[]), 0, len, key);
      phase = 3;
      continue;
    }
    // phase 3: DDHHMMZ
    if (!((len === 7 && u[a + 6] === 90) || len === 6)) return false;
    const day = dg(u, a) * 10 + dg(u, a + 1);
    const hh = dg(u, a + 2) * 10 + dg(u, a + 3);
    const mm = dg(u, a + 4) * 10 + dg(u, a + 5);
    if (day < 1 || day > 31 || hh < 0 || hh > 24 || mm < 0 || mm > 59 || (hh === 24 && mm !== 0)) return false;
    const t = reportTimeMs(day, hh, mm, ref);
    if (t !== t) return false;
    r.timeMs = t;
    phase = 4;
    if (last) break;
  }
  return phase >= 4 && whole < 0 && pk !== 1;
}
