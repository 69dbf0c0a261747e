/**
 * Present-weather groups `w'w'` (WMO-No. 306, FM 15, code table 4678; FMH-1 §12.6.8): intensity
 * (`-`, none, `+`) or proximity (`VC`), descriptor (MI PR BC DR BL SH TS FZ) and phenomena, as
 * two-letter codes — decoded by char codes into WX bit flags.
 */
import { WX } from '../../model/index.js';
import { asciiBytes } from './ascii.js';

/** Two-letter code → index key `c1 * 32 + c2` (upper-case letters only). */
function key(code: string): number {
  return (code.charCodeAt(0) - 64) * 32 + (code.charCodeAt(1) - 64);
}

/** Flags of each two-letter code (0 = known code without a flag of its own). -1 = not a code. */
const FLAGS = new Int32Array(32 * 32).fill(-1);
const P = WX.PRECIP;
const TABLE: Record<string, number> = {
  // descriptors (WMO-No. 306 code table 4678)
  MI: 0, PR: 0, BC: 0, DR: 0, BL: 0, SH: WX.SHOWER, TS: WX.THUNDER, FZ: WX.FREEZING,
  // precipitation
  DZ: WX.DRIZZLE | P, RA: WX.RAIN | P, SN: WX.SNOW | P, SG: WX.SNOW | P, IC: P, PL: WX.ICE_PELLETS | P,
  GR: WX.HAIL | P, GS: WX.HAIL | P, UP: P,
  // obscurations (only fog carries a flag; mist BR does not)
  BR: 0, FG: WX.FOG, FU: 0, VA: 0, DU: WX.DUST, SA: WX.DUST, HZ: 0, PY: 0,
  // other phenomena
  PO: WX.DUST, SQ: WX.SQUALL, FC: 0, SS: WX.DUST, DS: WX.DUST,
};
for (const [code, flags] of Object.entries(TABLE)) FLAGS[key(code)] = flags;

/** Flags that describe the weather at the station; a `VC` group keeps only the descriptor flags. */
const VICINITY_KEEP = WX.SHOWER | WX.THUNDER;

/**
 * WX flags of one present-weather group in u[a, b) (WMO-No. 306, FM 15, code table 4678; FMH-1 §12.6.8),
 * or -1 when it is not a weather group. `+` adds WX.HEAVY; a precipitation group adds WX.LIGHT with `-` and
 * WX.MODERATE without a sign (no sign is moderate intensity; none for BL/DR snow); `VC` (in the vicinity) keeps only SH/TS flags;
 * `//` (not observable) and `NSW` give 0.
 */
export function weatherFlagsAt(u: Uint8Array, a: number, b: number): number {
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
  if (n === 3 && i === a && u[i] === 78 && u[i + 1] === 83 && u[i + 2] === 87) return 0;
  if (n < 2 || (n & 1) !== 0) return -1;
  if (u[i] === 86 && u[i + 1] === 67) {
    if (c0 === 45 || c0 === 43) return -1;
    vicinity = true;
    i += 2;
    if (i === b) return -1;
  }
  // BL (blowing) and DR (low drifting) snow or sand is lifted, not falling: no intensity (FMH-1 §12.6.8)
  const lifted = (u[i] === 66 && u[i + 1] === 76) || (u[i] === 68 && u[i + 1] === 82);
  for (; i < b; i += 2) {
    const f = pairFlags(u, i);
    if (f < 0) return -1;
    flags |= f;
  }
  if (vicinity) return flags & VICINITY_KEEP;
  if (flags & WX.PRECIP && !lifted) {
    if (c0 === 45) flags |= WX.LIGHT;
    else if (c0 !== 43) flags |= WX.MODERATE;
  }
  return flags;
}

/** Flags of the two-letter weather code at u[i, i+2), -1 when it is none. */
function pairFlags(u: Uint8Array, i: number): number {
  const x = u[i]! - 64;
  const y = u[i + 1]! - 64;
  if (x < 1 || x > 26 || y < 1 || y > 26) return -1;
  return FLAGS[x * 32 + y]!;
}

/**
 * WX flags of one present-weather group in the text `s[a, b)` (see weatherFlagsAt), or -1 when it is not a
 * weather group.
 * @example weatherFlags('-SHRA', 0, 5) // WX.SHOWER | WX.RAIN | WX.PRECIP | WX.LIGHT
 */
export function weatherFlags(s: string, a: number, b: number): number {
  return weatherFlagsAt(asciiBytes(s), a, b);
}
