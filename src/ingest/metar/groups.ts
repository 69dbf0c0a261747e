/**
 * METAR/SPECI group decoders over bytes (WMO-No. 306 FM 15; FMH-1 ch. 12), shared by the general decoder
 * (decodeInto and decodeRemarks, on the ASCII view of their text) and the single-pass byte decoder.
 * Each takes the group at u[a, b) and returns whether it fits (writing into the report when it does).
 */
import { WX } from '../../model/index.js';
import type { MetarReport } from './metarReport.js';
import { HPA_PER_INHG, KMH_MS, KNOT_MS, MS_PER_DAY, MS_PER_HOUR, MS_PER_MINUTE } from '../../physics/constants.js';
import { weatherFlagsAt } from './weather.js';

export { asciiView } from './ascii.js';

/** Digit value of u[i], or -1000 (so that sums with a non-digit go negative). */
export function dg(u: Uint8Array, i: number): number {
  const c = u[i]! - 48;
  return c >= 0 && c <= 9 ? c : -1000;
}

/** Unsigned integer of the digits u[a, b), or -1 when empty or any byte is not a digit. */
export function digits(u: Uint8Array, a: number, b: number): number {
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
export function slashes(u: Uint8Array, a: number, b: number): boolean {
  if (b <= a) return false;
  for (let i = a; i < b; i++) if (u[i] !== 47) return false;
  return true;
}

/** Three bytes packed into one number (keyword tests). */
export const k3 = (u: Uint8Array, a: number) => (u[a]! << 16) | (u[a + 1]! << 8) | u[a + 2]!;
/** The first three letters of an ASCII word packed as k3 packs bytes. */
export const kw = (w: string) => (w.charCodeAt(0) << 16) | (w.charCodeAt(1) << 8) | w.charCodeAt(2);
const K_FEW = kw('FEW');
const K_SCT = kw('SCT');
const K_BKN = kw('BKN');
const K_OVC = kw('OVC');
const K_CLR = kw('CLR');
const K_SKC = kw('SKC');
const K_NSC = kw('NSC');
const K_NCD = kw('NCD');
const K_SLASH3 = kw('///');
const K_VRB = kw('VRB');

/** u[a, b) equals the ASCII word w. */
export function isWord(u: Uint8Array, a: number, b: number, w: string): boolean {
  const n = w.length;
  if (b - a !== n) return false;
  for (let i = 0; i < n; i++) if (u[a + i] !== w.charCodeAt(i)) return false;
  return true;
}

/**
 * Wind group `dddff(f)Gfmfm(fm)KT|MPS|KMH` (WMO-No. 306 FM 15 §15.5; FMH-1 §12.6.5): `VRB` direction,
 * `00000KT` calm, `P99KT`/`P49MPS` (≥ 100 kt / 50 m/s → stored as 100 kt / 50 m/s, the bound),
 * 3-digit US speeds (`210103G130KT`, AIM). Returns false when u[a, b) is not a wind group.
 */
export function windGroup(u: Uint8Array, a: number, b: number, r: MetarReport): boolean {
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

/** Visibility in statute miles ending in `SM` (FMH-1 §12.6.6): `10SM`, `1/2SM`, `M1/4SM`, `P6SM`, `11/2SM` (= 1 1/2). NaN when malformed. */
export function statuteMiles(u: Uint8Array, a: number, b: number): number {
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

/** Temperature / dew point `T'T'/T'dT'd` (FM 15 §15.11; FMH-1 §12.6.10): `M` minus, missing dew point `10/`, `10///`. */
export function tempGroup(u: Uint8Array, a: number, b: number, r: MetarReport): boolean {
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

/**
 * Lower the report's ceiling to a BKN, OVC or VV layer at `heightFt`: the ceiling is the lowest such layer
 * (FMH-1 §12.6.9). A layer of unknown height (`BKN///`) makes a report that so far had no ceiling unknown (NaN).
 */
export function lowerCeiling(r: MetarReport, heightFt: number): void {
  if (heightFt !== heightFt) {
    if (r.ceilingFt === Infinity) r.ceilingFt = NaN;
  } else if (!(r.ceilingFt <= heightFt)) r.ceilingFt = heightFt;
}

/** A sky group without a ceiling (CLR SKC NCD NSC CAVOK, FEW, SCT): no ceiling (+Infinity) unless a layer set one. */
export function noCeiling(r: MetarReport): void {
  if (r.ceilingFt !== r.ceilingFt) r.ceilingFt = Infinity;
}

/**
 * Sky group: `FEW|SCT|BKN|OVC hhh [CB|TCU|///]`, `VVhhh`, `//////`, CLR SKC NSC NCD (FM 15 §15.9;
 * FMH-1 §12.6.9). CB adds WX.CONVECTIVE; BKN, OVC and VV lower the ceiling (`lowerCeiling`); `lite` keeps no layer list.
 */
export function skyGroup(u: Uint8Array, a: number, b: number, r: MetarReport, lite: boolean): boolean {
  const len = b - a;
  let cover: string;
  let i: number;
  const k = k3(u, a);
  if (len === 3) {
    if (k === K_CLR) cover = 'CLR';
    else if (k === K_SKC) cover = 'SKC';
    else if (k === K_NSC) cover = 'NSC';
    else if (k === K_NCD) cover = 'NCD';
    else return false;
    noCeiling(r);
    if (!lite) r.sky.push({ cover, heightFt: NaN });
    return true;
  }
  if (u[a] === 86 && u[a + 1] === 86) {
    cover = 'VV';
    i = a + 2;
  } else if (len >= 6) {
    if (k === K_FEW) cover = 'FEW';
    else if (k === K_SCT) cover = 'SCT';
    else if (k === K_BKN) cover = 'BKN';
    else if (k === K_OVC) cover = 'OVC';
    else if (k === K_SLASH3) cover = '///';
    else return false;
    i = a + 3;
  } else return false;
  if (b - i < 3) return false;
  let h = digits(u, i, i + 3);
  if (h < 0) {
    if (!slashes(u, i, i + 3)) return false;
    h = NaN;
  } else h *= 100;
  i += 3;
  let type: string | undefined;
  if (i < b) {
    if (isWord(u, i, b, 'CB')) {
      type = 'CB';
      r.weather |= WX.CONVECTIVE;
    } else if (isWord(u, i, b, 'TCU')) type = 'TCU';
    else if (slashes(u, i, b)) type = '///';
    else return false;
  }
  if (cover === 'BKN' || cover === 'OVC' || cover === 'VV') lowerCeiling(r, h);
  else if (cover !== '///') noCeiling(r);
  if (!lite) r.sky.push(type === undefined ? { cover, heightFt: h } : { cover, heightFt: h, cloudType: type });
  return true;
}

/** Compass suffix of directional visibility (N NE E SE S SW W NW, NDV). */
export function compassSuffix(u: Uint8Array, a: number, b: number): boolean {
  const n = b - a;
  if (n === 3) return u[a] === 78 && u[a + 1] === 68 && u[a + 2] === 86;
  if (n === 1) {
    const c = u[a];
    return c === 78 || c === 69 || c === 83 || c === 87;
  }
  if (n === 2) {
    const c = u[a];
    const d = u[a + 1];
    return (c === 78 || c === 83) && (d === 69 || d === 87);
  }
  return false;
}

/** `Qhhhh` (hPa) or `Ahhhh` (hundredths of inHg) — FM 15 §15.12; FMH-1 §12.6.11. `////` = missing. */
export function pressureGroup(u: Uint8Array, a: number, b: number, r: MetarReport): boolean {
  if (b - a !== 5) return false;
  const v = digits(u, a + 1, b);
  if (v < 0 && !slashes(u, a + 1, b)) return false;
  if (u[a] === 81) r.qnhHpa = v < 0 ? NaN : v;
  else r.altimeterHpa = v < 0 ? NaN : (v / 100) * HPA_PER_INHG;
  return true;
}

/** Signed tenths `snTTT` at u[a, a+4): sign digit 0 (+) or 1 (−), then tenths of °C (FMH-1 §12.7.2); NaN when malformed. */
export function signedTenths(u: Uint8Array, a: number): number {
  const sg = u[a];
  const v = dg(u, a + 1) * 100 + dg(u, a + 2) * 10 + dg(u, a + 3);
  if (v < 0 || (sg !== 48 && sg !== 49)) return NaN;
  return sg === 49 ? (v === 0 ? 0 : -v / 10) : v / 10;
}

/**
 * Begin/end times of weather (FMH-1 §12.7.1(h)): `RAB07`, `RAE21B40`, `FZRAB1155E20`,
 * `RAE34TSE41GRB0157E08`, `RAEMM` (minutes missing). True when the whole token fits.
 */
export function beginEnd(u: Uint8Array, a: number, b: number): boolean {
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
      if (weatherFlagsAt(u, i, i + 2) < 0) return false;
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

/**
 * Time of a remark given as `mm` (hh < 0: minutes past the report's hour) or `hhmm`, placed at or
 * before the report time (FMH-1 §12.7: peak wind and wind shift times lie within the last hour).
 */
export function remarkTimeMs(reportMs: number, hh: number, mm: number): number {
  if (!Number.isFinite(reportMs) || mm > 59 || hh > 23) return NaN;
  if (hh < 0) {
    let t = Math.floor(reportMs / MS_PER_HOUR) * MS_PER_HOUR + mm * MS_PER_MINUTE;
    if (t > reportMs) t -= MS_PER_HOUR;
    return t;
  }
  let t = Math.floor(reportMs / MS_PER_DAY) * MS_PER_DAY + hh * MS_PER_HOUR + mm * MS_PER_MINUTE;
  if (t > reportMs) t -= MS_PER_DAY;
  return t;
}

/** `(hh)mm` time token: 2 or 4 digits → [hh or -1, mm], or null. */
export function hhmm(u: Uint8Array, a: number, b: number): [number, number] | null {
  const len = b - a;
  if (len === 2) {
    const m = digits(u, a, b);
    return m >= 0 && m <= 59 ? [-1, m] : null;
  }
  if (len === 4) {
    const h = digits(u, a, a + 2);
    const m = digits(u, a + 2, b);
    return h >= 0 && h <= 23 && m >= 0 && m <= 59 ? [h, m] : null;
  }
  return null;
}

/** `dddff(f)/(hh)mm` after `PK WND` (FMH-1 §12.7.1(k)); keeps the strongest when several are given. */
export function peakWind(u: Uint8Array, a: number, b: number, r: MetarReport): boolean {
  let k = a;
  while (k < b && u[k] !== 47) k++;
  if (k >= b) return false;
  const dir = digits(u, a, a + 3);
  const spd = digits(u, a + 3, k);
  if (dir < 0 || dir > 360 || spd < 0 || k - a - 3 < 2 || k - a - 3 > 3) return false;
  const tm = hhmm(u, k + 1, b);
  if (!tm) return false;
  const ms = spd * KNOT_MS;
  if (!(ms <= r.peakWindMs)) {
    r.peakWindMs = ms;
    r.peakWindDirDeg = dir;
    r.peakWindTimeMs = remarkTimeMs(r.timeMs, tm[0], tm[1]);
  }
  return true;
}
