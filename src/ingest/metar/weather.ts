/**
 * Present-weather groups `w'w'` (WMO-No. 306, FM 15, code table 4678; FMH-1 §12.6.8): intensity
 * (`-`, none, `+`) or proximity (`VC`), descriptor (MI PR BC DR BL SH TS FZ) and phenomena, as
 * two-letter codes — decoded by char codes into WX bit flags.
 */
import { WX } from '../types.js';

/** Two-letter code → index key `c1 * 32 + c2` (upper-case letters only). */
function key(code: string): number {
  return (code.charCodeAt(0) - 64) * 32 + (code.charCodeAt(1) - 64);
}

/** Flags of each two-letter code (0 = known code without a flag of its own). -1 = not a code. */
const FLAGS = new Int32Array(32 * 32).fill(-1);
/** Flags by two-letter code key `(c1 - 64) * 32 + (c2 - 64)` (read-only for other modules). */
export const WX_CODE_FLAGS: Int32Array = FLAGS;
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
 * WX flags of one present-weather group in `s[a, b)`, or -1 when it is not a weather group.
 * `+` adds WX.HEAVY; `VC` (in the vicinity, not at the station) keeps only SH/TS flags.
 * `//` (not observable, automatic stations) gives 0. `NSW` (no significant weather) gives 0.
 * @example weatherFlags('-SHRA', 0, 5) // WX.SHOWER | WX.RAIN | WX.PRECIP
 */
export function weatherFlags(s: string, a: number, b: number): number {
  let i = a;
  let flags = 0;
  let vicinity = false;
  const c0 = s.charCodeAt(i);
  if (c0 === 45 /* - */) i++;
  else if (c0 === 43 /* + */) {
    flags |= WX.HEAVY;
    i++;
  }
  const n = b - i;
  if (n === 2 && s.charCodeAt(i) === 47 && s.charCodeAt(i + 1) === 47 && i === a) return 0;
  if (n === 3 && i === a && s.startsWith('NSW', i)) return 0;
  if (n < 2 || (n & 1) !== 0) return -1;
  if (s.charCodeAt(i) === 86 /* V */ && s.charCodeAt(i + 1) === 67 /* C */) {
    if (c0 === 45 || c0 === 43) return -1;
    vicinity = true;
    i += 2;
    if (i === b) return -1;
  }
  for (; i < b; i += 2) {
    const x = s.charCodeAt(i) - 64;
    const y = s.charCodeAt(i + 1) - 64;
    if (x < 1 || x > 26 || y < 1 || y > 26) return -1;
    const f = FLAGS[x * 32 + y]!;
    if (f < 0) return -1;
    flags |= f;
  }
  if (vicinity) flags &= VICINITY_KEEP;
  return flags;
}
