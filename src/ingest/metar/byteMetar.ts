/**
 * Single-pass decoder for the common shape of a METAR/SPECI line, reading the file's bytes
 * (WMO-No. 306 FM 15/16 body, FMH-1 ch. 12 remarks). It walks the line once, without a token array or
 * substrings, and decodes the usual groups exactly as decodeInto does in lite mode. Any group or form it
 * does not handle, and any byte that is not printable ASCII or a blank, makes it give up (return false):
 * the caller then decodes that line as text with decodeInto, so results are the same either way
 * (test/ingest/metar-fastpath.test.ts checks it line by line).
 */
import { WX } from '../types.js';
import { reportTimeMs } from './calendar.js';
import { knownStation, internStation, resetReport, type DecodeRef, type MetarReport } from './decodeMetar.js';
import { remarkTimeMs } from './remarks.js';
import { INCH_MM, INHG_HPA, KMH_MS, KNOT_MS, STATUTE_MILE_M } from './units.js';
import { WX_CODE_FLAGS } from './weather.js';

/** Digit value of u[i], or -1000 (so that sums with a non-digit go negative). */
function dg(u: Uint8Array, i: number): number {
  const c = u[i]! - 48;
  return c >= 0 && c <= 9 ? c : -1000;
}

/** Unsigned integer of the digits u[a, b), or -1 when empty or any byte is not a digit. */
function digits(u: Uint8Array, a: number, b: number): number {
  if (b <= a) return -1;
  let v = 0;
  for (let i = a; i < b; i++) {
    const c = u[i]! - 48;
    if (c < 0 || c > 9) return -1;
    v = v * 10 + c;
  }
  return v;
}

/** u[a, b) consists only of '/'. */
function slashes(u: Uint8Array, a: number, b: number): boolean {
  if (b <= a) return false;
  for (let i = a; i < b; i++) if (u[i] !== 47) return false;
  return true;
}

/** Three bytes packed into one number (keyword tests). */
const k3 = (u: Uint8Array, a: number) => (u[a]! << 16) | (u[a + 1]! << 8) | u[a + 2]!;
const kw = (w: string) => (w.charCodeAt(0) << 16) | (w.charCodeAt(1) << 8) | w.charCodeAt(2);
const K_RMK = kw('RMK');
const K_FEW = kw('FEW');
const K_SCT = kw('SCT');
const K_BKN = kw('BKN');
const K_OVC = kw('OVC');
const K_CLR = kw('CLR');
const K_SKC = kw('SKC');
const K_NSC = kw('NSC');
const K_NCD = kw('NCD');
const K_SLASH3 = kw('///');
const K_MET = kw('MET');
const K_SPE = kw('SPE');
const K_COR = kw('COR');
const K_WND = kw('WND');
const K_AUT = kw('AUT');
const K_CAV = kw('CAV');
const K_NOS = kw('NOS');
const K_NIL = kw('NIL');
const K_BEC = kw('BEC');
const K_TEM = kw('TEM');
const K_PRE = kw('PRE');
const K_NSW = kw('NSW');
const K_VRB = kw('VRB');
const K_RWY = kw('RWY');

/** u[a, b) equals the ASCII word w (w's first three letters packed in `k`). */
function isWord(u: Uint8Array, a: number, b: number, k: number, w: string): boolean {
  const n = w.length;
  if (b - a !== n || k3(u, a) !== k) return false;
  for (let i = 3; i < n; i++) if (u[a + i] !== w.charCodeAt(i)) return false;
  return true;
}

/** Wind group, as windGroup in decodeMetar.ts (WMO-No. 306 FM 15 §15.5; FMH-1 §12.6.5). */
function windGroup(u: Uint8Array, a: number, b: number, r: MetarReport): boolean {
  if (b - a < 7) return false;
  let e: number;
  let f: number;
  const cl = u[b - 1];
  if (cl === 84 && u[b - 2] === 75) {
    e = b - 2;
    f = KNOT_MS;
  } else if (cl === 83 && u[b - 2] === 80 && u[b - 3] === 77) {
    e = b - 3;
    f = 1;
  } else if (cl === 72 && u[b - 2] === 77 && u[b - 3] === 75) {
    e = b - 3;
    f = KMH_MS;
  } else return false;
  let dir: number;
  let variable = false;
  const d = dg(u, a) * 100 + dg(u, a + 1) * 10 + dg(u, a + 2);
  if (d >= 0) {
    if (d > 360) return false;
    dir = d;
  } else if (k3(u, a) === K_VRB) {
    dir = NaN;
    variable = true;
  } else if (slashes(u, a, a + 3)) dir = NaN;
  else return false;
  let i = a + 3;
  let plus = false;
  if (u[i] === 80) {
    plus = true;
    i++;
  }
  let j = i;
  while (j < e && u[j] !== 71) j++;
  let speed: number;
  if (j - i === 2 && slashes(u, i, j)) speed = NaN;
  else {
    if (j - i < 2 || j - i > 3) return false;
    speed = digits(u, i, j);
    if (speed < 0) return false;
    if (plus) speed++;
  }
  let gust = NaN;
  if (j < e) {
    i = j + 1;
    plus = false;
    if (u[i] === 80) {
      plus = true;
      i++;
    }
    if (e - i === 2 && slashes(u, i, e)) gust = NaN;
    else {
      if (e - i < 2 || e - i > 3) return false;
      gust = digits(u, i, e);
      if (gust < 0) return false;
      if (plus) gust++;
      gust *= f;
    }
  }
  r.windDirDeg = speed === 0 && d === 0 ? 0 : dir;
  r.windSpeedMs = speed * f;
  r.gustMs = gust;
  r.windVariable = variable;
  return true;
}

/** Statute miles ending in `SM`, as statuteMiles in decodeMetar.ts (FMH-1 §12.6.6); NaN when malformed. */
function statuteMiles(u: Uint8Array, a: number, b: number): number {
  let i = a;
  const c0 = u[i];
  if (c0 === 77 || c0 === 80) i++;
  const e = b - 2;
  let k = i;
  while (k < e && u[k] !== 47) k++;
  if (k === e) {
    const v = digits(u, i, e);
    return v < 0 ? NaN : v;
  }
  const num = digits(u, i, k);
  const den = digits(u, k + 1, e);
  if (num < 0 || den <= 0) return NaN;
  if (num > den && num >= 10) return Math.floor(num / 10) + (num % 10) / den;
  return num / den;
}

/** Temperature half `M?dd` or `//`: value, NaN for missing, -999 when malformed. */
function tempHalf(u: Uint8Array, a: number, b: number): number {
  if (b - a === 2 && u[a] === 47 && u[a + 1] === 47) return NaN;
  let neg = false;
  if (u[a] === 77) {
    neg = true;
    a++;
  }
  if (b - a !== 2) return -999;
  const v = dg(u, a) * 10 + dg(u, a + 1);
  if (v < 0) return -999;
  return neg ? (v === 0 ? 0 : -v) : v;
}

/** Temperature / dew point, as tempGroup in decodeMetar.ts (FM 15 §15.11; FMH-1 §12.6.10). */
function tempGroup(u: Uint8Array, a: number, b: number, r: MetarReport): boolean {
  let k = a;
  while (k < b && u[k] !== 47) k++;
  if (k === a) {
    if (b - a < 3 || u[a + 1] !== 47 || u[a + 2] !== 47) return false;
    k = a + 2;
  }
  if (k >= b) return false;
  const t = tempHalf(u, a, k);
  if (t === -999) return false;
  let td = NaN;
  if (k + 1 < b) {
    td = tempHalf(u, k + 1, b);
    if (td === -999) return false;
  }
  r.temperatureC = t;
  r.dewpointC = td;
  return true;
}

/** Sky group in lite mode (validated, only CB kept as a flag), as skyGroup in decodeMetar.ts (FM 15 §15.9; FMH-1 §12.6.9). */
function skyGroup(u: Uint8Array, a: number, b: number, r: MetarReport): boolean {
  const len = b - a;
  let i: number;
  const k = k3(u, a);
  if (len === 3) return k === K_CLR || k === K_SKC || k === K_NSC || k === K_NCD;
  if (u[a] === 86 && u[a + 1] === 86) i = a + 2;
  else if (len >= 6 && (k === K_FEW || k === K_SCT || k === K_BKN || k === K_OVC || k === K_SLASH3)) i = a + 3;
  else return false;
  if (b - i < 3) return false;
  if (digits(u, i, i + 3) < 0 && !slashes(u, i, i + 3)) return false;
  i += 3;
  if (i < b) {
    const n = b - i;
    if (n === 2 && u[i] === 67 && u[i + 1] === 66) r.weather |= WX.CONVECTIVE;
    else if (!(n === 3 && u[i] === 84 && u[i + 1] === 67 && u[i + 2] === 85) && !slashes(u, i, b)) return false;
  }
  return true;
}

/** `Qhhhh` / `Ahhhh`, as pressureGroup in decodeMetar.ts (FM 15 §15.12; FMH-1 §12.6.11). */
function pressureGroup(u: Uint8Array, a: number, b: number, r: MetarReport): boolean {
  if (b - a !== 5) return false;
  const v = digits(u, a + 1, b);
  if (v < 0 && !slashes(u, a + 1, b)) return false;
  if (u[a] === 81) r.qnhHpa = v < 0 ? NaN : v;
  else r.altimeterHpa = v < 0 ? NaN : (v / 100) * INHG_HPA;
  return true;
}

/** WX flags of a present-weather group, -1 when it is not one; as weatherFlags in weather.ts (WMO-No. 306 code table 4678). */
function weatherFlags(u: Uint8Array, a: number, b: number): number {
  let i = a;
  let flags = 0;
  let vicinity = false;
  const c0 = u[i];
  if (c0 === 45) i++;
  else if (c0 === 43) {
    flags |= WX.HEAVY;
    i++;
  }
  const n = b - i;
  if (n === 2 && u[i] === 47 && u[i + 1] === 47 && i === a) return 0;
  if (n === 3 && i === a && k3(u, i) === K_NSW) return 0;
  if (n < 2 || (n & 1) !== 0) return -1;
  if (u[i] === 86 && u[i + 1] === 67) {
    if (c0 === 45 || c0 === 43) return -1;
    vicinity = true;
    i += 2;
    if (i === b) return -1;
  }
  for (; i < b; i += 2) {
    const f = pairFlags(u, i);
    if (f < 0) return -1;
    flags |= f;
  }
  if (vicinity) flags &= WX.SHOWER | WX.THUNDER;
  return flags;
}

/** Flags of the two-letter weather code at u[i, i+2), -1 when it is none. */
function pairFlags(u: Uint8Array, i: number): number {
  const x = u[i]! - 64;
  const y = u[i + 1]! - 64;
  if (x < 1 || x > 26 || y < 1 || y > 26) return -1;
  return WX_CODE_FLAGS[x * 32 + y]!;
}

/** Signed tenths `snTTT` at u[a, a+4), as signedTenths in remarks.ts; NaN when malformed. */
function signedTenths(u: Uint8Array, a: number): number {
  const sg = u[a];
  const v = dg(u, a + 1) * 100 + dg(u, a + 2) * 10 + dg(u, a + 3);
  if (v < 0 || (sg !== 48 && sg !== 49)) return NaN;
  return sg === 49 ? (v === 0 ? 0 : -v / 10) : v / 10;
}

/** Begin/end times of weather (`RAB07`, `RAE21B40`), as beginEnd in remarks.ts (FMH-1 §12.7.1(h)). */
function beginEnd(u: Uint8Array, a: number, b: number): boolean {
  let i = a;
  let parts = 0;
  while (i < b) {
    const c = u[i];
    if (c === 45 || c === 43) i++;
    const ws = i;
    while (i + 1 < b) {
      const x = u[i];
      const nx = u[i + 1]!;
      if ((x === 66 || x === 69) && i > ws && ((nx >= 48 && nx <= 57) || nx === 77)) break;
      if (weatherFlags(u, i, i + 2) < 0) return false;
      i += 2;
    }
    if (i === ws) return false;
    let times = 0;
    while (i < b) {
      const x = u[i];
      if (x !== 66 && x !== 69) break;
      i++;
      if (u[i] === 77 && u[i + 1] === 77) i += 2;
      else {
        let k = i;
        while (k < b && u[k]! >= 48 && u[k]! <= 57) k++;
        if (k - i !== 2 && k - i !== 4) return false;
        i = k;
      }
      times++;
    }
    if (times === 0) return false;
    parts++;
  }
  return parts > 0;
}

/** `dddff(f)/(hh)mm` after `PK WND`, as peakWind in remarks.ts (FMH-1 §12.7.1(k)). */
function peakWind(u: Uint8Array, a: number, b: number, r: MetarReport): boolean {
  let k = a;
  while (k < b && u[k] !== 47) k++;
  if (k >= b) return false;
  const dir = digits(u, a, a + 3);
  const spd = digits(u, a + 3, k);
  if (dir < 0 || dir > 360 || spd < 0 || k - a - 3 < 2 || k - a - 3 > 3) return false;
  const n = b - k - 1;
  let hh = -1;
  let mm: number;
  if (n === 2) {
    mm = digits(u, k + 1, b);
    if (!(mm >= 0 && mm <= 59)) return false;
  } else if (n === 4) {
    hh = digits(u, k + 1, k + 3);
    mm = digits(u, k + 3, b);
    if (!(hh >= 0 && hh <= 23 && mm >= 0 && mm <= 59)) return false;
  } else return false;
  const ms = spd * KNOT_MS;
  if (!(ms <= r.peakWindMs)) {
    r.peakWindMs = ms;
    r.peakWindDirDeg = dir;
    r.peakWindTimeMs = remarkTimeMs(r.timeMs, hh, mm);
  }
  return true;
}

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
        // FEWhhh SCThhh BKNhhh OVChhh: nothing to keep in lite mode
        const k = k3(u, a);
        if ((k === K_FEW || k === K_SCT || k === K_BKN || k === K_OVC) && dg(u, a + 3) + dg(u, a + 4) + dg(u, a + 5) >= 0) continue;
      } else if (len === 5 && c0 === 65) {
        const v = digits(u, a + 1, b);
        if (v >= 0) {
          r.altimeterHpa = (v / 100) * INHG_HPA;
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
          if (isWord(u, a, b, K_CAV, 'CAVOK')) {
            r.cavok = true;
            r.visibilityM = 10000;
            visSet = true;
            continue;
          }
          if (len === 3 && (k3(u, a) === K_COR || u[a + 1] === 67)) return false;
          break;
        case 65: // AUTO, Ahhhh
          if (isWord(u, a, b, K_AUT, 'AUTO')) {
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
          if (isWord(u, a, b, K_NOS, 'NOSIG')) continue;
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
          if (isWord(u, a, b, K_BEC, 'BECMG') || isWord(u, a, b, K_TEM, 'TEMPO')) {
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
      if (skyGroup(u, a, b, r)) continue;
      const wf = weatherFlags(u, a, b);
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
      r.station = knownStation(key) ?? internStation(String.fromCharCode.apply(null, u.subarray(a, b) as unknown as number[]), 0, len, key);
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
