/**
 * The bytes of an input file before a reader sees them: is it text at all, which character encoding, and
 * which line ends. One home for these decisions, shared by the METAR and CSV readers (readPaths.ts calls it).
 *
 * Rules (decided here; test/ingest/text.test.ts pins them):
 * - Binary: a file is binary only when most of its sampled head (more than half of the first 64 KiB) is
 *   not text: control bytes other than tab, line feed, vertical tab, form feed, carriage return and escape,
 *   plus bytes outside a valid UTF-8 sequence (common practice, no source). A few NUL bytes in a text file
 *   do not make it binary: the readers reject the lines that hold them (`control-bytes`).
 * - Encoding: UTF-8 when the bytes are valid UTF-8 (WHATWG Encoding Standard, UTF-8 decoder with
 *   `fatal`); otherwise windows-1252 (WHATWG Encoding Standard: the label `latin1`/`iso-8859-1` means
 *   windows-1252, a superset of ISO-8859-1 for the printable range), and the file report says so.
 * - A UTF-8 byte order mark (EF BB BF, Unicode Standard §23.8) at the start is dropped.
 * - Line ends: LF, CRLF and a lone CR each end one line (a lone CR is the classic Mac OS line end). A file
 *   whose ends are all LF or all CRLF is left as it is (no copy); a file with lone CRs or a mix is rewritten
 *   with LF ends, so each physical line keeps its number.
 */
import { isUtf8 } from 'node:buffer';

/** What `prepareText` found and did. */
export interface PreparedText {
  /** The bytes to read: UTF-8, no BOM, LF or CRLF line ends throughout. */
  bytes: Buffer;
  /** The encoding the file was read in. */
  encoding: 'utf-8' | 'windows-1252';
  /** A BOM was dropped. */
  bom: boolean;
  /** Lone CRs or mixed line ends were rewritten to LF; the counts of each kind found. */
  lineEnds: { lf: number; crlf: number; cr: number; rewritten: boolean };
  /** The text holds a NUL byte somewhere: the readers reject the lines that hold one. */
  hasNul: boolean;
  /** Notes for the file report. */
  notes: string[];
}

/** Bytes sampled for the binary decision. */
export const BINARY_SAMPLE = 1 << 16;

/** True for a control byte that never appears in text (not \t \n \v \f \r or ESC). */
export function isControlByte(c: number): boolean {
  return (c < 32 && c !== 9 && c !== 10 && c !== 11 && c !== 12 && c !== 13 && c !== 27) || c === 127;
}

/** Length of a valid UTF-8 sequence starting at u[i] (1–4), or 0 when the bytes there are not one (RFC 3629 §4). */
function utf8SequenceLength(u: Uint8Array, i: number, end: number): number {
  const c = u[i]!;
  if (c < 0x80) return 1;
  let n: number;
  let min: number;
  if (c >= 0xc2 && c <= 0xdf) {
    n = 2;
    min = 0x80;
  } else if (c >= 0xe0 && c <= 0xef) {
    n = 3;
    min = 0x800;
  } else if (c >= 0xf0 && c <= 0xf4) {
    n = 4;
    min = 0x10000;
  } else return 0;
  if (i + n > end) return 0;
  let cp = c & (0xff >> (n + 1));
  for (let k = 1; k < n; k++) {
    const d = u[i + k]!;
    if ((d & 0xc0) !== 0x80) return 0;
    cp = (cp << 6) | (d & 0x3f);
  }
  if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return 0;
  return n;
}

/** Share (0–1) of the first `sample` bytes that are not text (control bytes, bytes outside valid UTF-8). */
export function nonTextShare(u: Uint8Array, sample = BINARY_SAMPLE): number {
  const end = Math.min(u.length, sample);
  if (end === 0) return 0;
  let bad = 0;
  let i = 0;
  while (i < end) {
    const c = u[i]!;
    if (c < 0x80) {
      if (isControlByte(c)) bad++;
      i++;
      continue;
    }
    const n = utf8SequenceLength(u, i, u.length);
    if (n === 0) {
      bad++;
      i++;
    } else i += n;
  }
  return bad / end;
}

/** The binary rule of the module comment. */
export function looksBinary(u: Uint8Array): boolean {
  return nonTextShare(u) > 0.5;
}

const cp1252 = new TextDecoder('windows-1252');

/** True when the bytes are valid UTF-8 (node:buffer isUtf8, native). */
export function isValidUtf8(u: Uint8Array): boolean {
  return isUtf8(u);
}

/**
 * Prepare a file's bytes for the readers (module comment): encoding, BOM, line ends.
 * @example prepareText(Buffer.from('a\rb\r')).bytes.toString() // 'a\nb\n'
 */
export function prepareText(input: Uint8Array): PreparedText {
  let u = Buffer.isBuffer(input) ? input : Buffer.from(input.buffer, input.byteOffset, input.byteLength);
  const notes: string[] = [];
  let encoding: PreparedText['encoding'] = 'utf-8';
  let bom = false;
  if (u[0] === 0xef && u[1] === 0xbb && u[2] === 0xbf) {
    u = u.subarray(3);
    bom = true;
  }
  if (!isValidUtf8(u)) {
    encoding = 'windows-1252';
    u = Buffer.from(cp1252.decode(u), 'utf8');
    notes.push('not valid UTF-8: read as Windows-1252 (Latin-1); save the file as UTF-8 to be sure of its characters');
  }
  const lineEnds = { lf: 0, crlf: 0, cr: 0, rewritten: false };
  if (u.indexOf(13) >= 0) {
    const c = countLineEnds(u);
    lineEnds.lf = c.lf - c.crlf;
    lineEnds.crlf = c.crlf;
    lineEnds.cr = c.cr;
  }
  if (lineEnds.cr > 0 || (lineEnds.crlf > 0 && lineEnds.lf > 0)) {
    u = lineEndsToLf(u);
    lineEnds.rewritten = true;
    notes.push(lineEndsNote(lineEnds.lf, lineEnds.crlf, lineEnds.cr));
  }
  return { bytes: u, encoding, bom, lineEnds, hasNul: u.indexOf(0) >= 0, notes };
}

/** Line ends in `u`, counted with native searches: every LF (CRLF included), CRLF pairs, lone CRs. */
export function countLineEnds(u: Buffer): { lf: number; crlf: number; cr: number } {
  let lf = 0;
  for (let i = u.indexOf(10); i >= 0; i = u.indexOf(10, i + 1)) lf++;
  let crlf = 0;
  let cr = 0;
  for (let i = u.indexOf(13); i >= 0; i = u.indexOf(13, i + 1)) {
    if (u[i + 1] === 10) crlf++;
    else cr++;
  }
  return { lf, crlf, cr };
}

/** `u` with every CRLF and lone CR as LF (a copy). */
export function lineEndsToLf(u: Buffer): Buffer {
  const out = Buffer.allocUnsafe(u.length);
  let k = 0;
  for (let i = 0; i < u.length; i++) {
    const c = u[i]!;
    if (c === 13) {
      out[k++] = 10;
      if (u[i + 1] === 10) i++;
    } else out[k++] = c;
  }
  return out.subarray(0, k);
}

/** The report note for rewritten line ends. */
export function lineEndsNote(lf: number, crlf: number, cr: number): string {
  const kinds = [lf && `${lf} LF`, crlf && `${crlf} CRLF`, cr && `${cr} CR`].filter(Boolean);
  return `line ends ${kinds.join(', ')}: each read as the end of one line`;
}

/**
 * A text's line ends made one kind (module comment): `text` unchanged (note null) when it has no lone CR and
 * does not mix CRLF with LF, else every CRLF and lone CR as LF, with the note prepareText gives.
 * @example normalizeLineEnds('a\r\nb\nc\rd').text // 'a\nb\nc\nd'
 */
export function normalizeLineEnds(text: string): { text: string; note: string | null } {
  if (text.indexOf('\r') < 0) return { text, note: null };
  const crlf = text.match(/\r\n/g)?.length ?? 0;
  const cr = text.match(/\r(?!\n)/g)?.length ?? 0;
  const lf = (text.match(/\n/g)?.length ?? 0) - crlf;
  if (cr === 0 && !(crlf > 0 && lf > 0)) return { text, note: null };
  return { text: text.replace(/\r\n?/g, '\n'), note: lineEndsNote(lf, crlf, cr) };
}
