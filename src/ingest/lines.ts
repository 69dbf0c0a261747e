/**
 * Text arriving as a stream of byte chunks → blocks of whole lines, ready for the readers. One home for
 * cutting a stream at line ends; the decisions on the bytes themselves (encoding, BOM, line-end kinds, NUL)
 * follow the rules of text.ts, which `prepareText` applies to a whole buffer:
 * - A block always ends at a line end (or is the last piece of the input), so a line, a CRLF pair or a UTF-8
 *   sequence is never cut in two, whatever the chunk sizes.
 * - A UTF-8 byte order mark at the very start is dropped.
 * - Encoding: UTF-8 while the blocks are valid UTF-8 (WHATWG Encoding Standard, UTF-8 decoder with `fatal`);
 *   from the first block that is not, windows-1252 for the rest of the input (noted; with `encoding` given
 *   the whole input is read in it, which is what `prepareText` decides for a buffer held whole). The first
 *   block holds the first chunk (at least the first 64 KiB when the chunks are that large).
 * - Line ends: LF, CRLF and a lone CR each end one line. A block with lone CRs (or, with `lf: true`, any CR)
 *   is rewritten with LF ends; so every physical line keeps its number (`firstLine` of each block).
 *   The note of rewritten or mixed line ends counts every kind over the whole input, as `prepareText` does.
 */
import { countLineEnds, isValidUtf8, lineEndsNote, lineEndsToLf } from './text.js';

/** A run of whole lines: UTF-8, no BOM, LF (or, unless `lf`, CRLF) line ends; the last may lack its end. */
export interface TextBlock {
  bytes: Buffer;
  /** Physical line number (1-based) of the block's first line. */
  firstLine: number;
  /** The block holds a NUL byte: the readers reject the lines that hold one. */
  hasNul: boolean;
  /** This is the last block of the input. */
  last: boolean;
}

export interface LineSplitterOptions {
  /** Read the whole input in this encoding (decided beforehand on all of it); default: decided block by block. */
  encoding?: 'utf-8' | 'windows-1252';
  /** Rewrite every CRLF to LF too (default false: blocks of CRLF lines pass unchanged). */
  lf?: boolean;
}

const cp1252 = new TextDecoder('windows-1252');

/** The note for input read as windows-1252 (also prepareText's). */
export const WINDOWS_1252_NOTE = 'not valid UTF-8: read as Windows-1252 (Latin-1); save the file as UTF-8 to be sure of its characters';

/**
 * Cut a byte stream into blocks of whole lines (module comment). `push` each chunk as it arrives, then `end`;
 * each returns the block now complete, or null.
 * @example
 * const s = new LineSplitter();
 * s.push(Buffer.from('a\r')); // null (the CR may start a CRLF)
 * s.push(Buffer.from('\nb')).bytes.toString(); // 'a\r\n'
 * s.end().bytes.toString(); // 'b'
 */
export class LineSplitter {
  private carry: Buffer | null = null;
  private started = false;
  private line = 1;
  private encoding: 'utf-8' | 'windows-1252' | null;
  private switchedAt = 0;
  private readonly lf: boolean;
  private lfCount = 0;
  private crlfCount = 0;
  private crCount = 0;
  /** A BOM was dropped. */
  bom = false;

  constructor(opts: LineSplitterOptions = {}) {
    this.encoding = opts.encoding ?? null;
    this.lf = opts.lf ?? false;
  }

  /** The block of whole lines completed by `chunk`, or null. */
  push(chunk: Uint8Array): TextBlock | null {
    if (chunk.length === 0) return null;
    let data = Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength);
    if (this.carry !== null) {
      data = Buffer.concat([this.carry, data]);
      this.carry = null;
    }
    if (!this.started) {
      // the BOM may arrive split over chunks: wait for three bytes
      if (data.length < 3) {
        this.carry = data;
        return null;
      }
      this.started = true;
      if (data[0] === 0xef && data[1] === 0xbb && data[2] === 0xbf) {
        data = data.subarray(3);
        this.bom = true;
      }
    }
    // the cut: after the last LF, or after the last CR not at the very end (a final CR may start a CRLF)
    const lf = data.lastIndexOf(10);
    let cr = data.lastIndexOf(13);
    if (cr === data.length - 1) cr = cr > 0 ? data.lastIndexOf(13, cr - 1) : -1;
    const cut = Math.max(lf, cr) + 1;
    if (cut < data.length) this.carry = Buffer.from(data.subarray(cut));
    if (cut === 0) return null;
    return this.block(data.subarray(0, cut), false);
  }

  /** The last block (the input's end), or null when nothing is left. */
  end(): TextBlock | null {
    let data = this.carry;
    this.carry = null;
    if (!this.started && data !== null) {
      this.started = true;
      if (data[0] === 0xef && data[1] === 0xbb && data[2] === 0xbf) {
        data = data.subarray(3);
        this.bom = true;
      }
    }
    return this.block(data ?? Buffer.alloc(0), true);
  }

  /** Notes for the file report (encoding, line ends), as prepareText words them. */
  notes(): string[] {
    const notes: string[] = [];
    if (this.encoding === 'windows-1252')
      notes.push(this.switchedAt > 1 ? `${WINDOWS_1252_NOTE.replace(':', ` from line ${this.switchedAt} on:`)}` : WINDOWS_1252_NOTE);
    if (this.crCount > 0 || (this.crlfCount > 0 && this.lfCount > 0)) notes.push(lineEndsNote(this.lfCount, this.crlfCount, this.crCount));
    return notes;
  }

  /** The encoding read so far (windows-1252 once a block was not valid UTF-8). */
  get encodingUsed(): 'utf-8' | 'windows-1252' {
    return this.encoding ?? 'utf-8';
  }

  private block(raw: Buffer, last: boolean): TextBlock {
    let u = raw;
    if (this.encoding === null && !isValidUtf8(u)) {
      this.encoding = 'windows-1252';
      this.switchedAt = this.line;
    }
    if (this.encoding === 'windows-1252') u = Buffer.from(cp1252.decode(u), 'utf8');
    // line ends: counted in every block (the physical line numbers)
    const c = countLineEnds(u);
    this.lfCount += c.lf - c.crlf;
    this.crlfCount += c.crlf;
    this.crCount += c.cr;
    if (c.cr > 0 || (c.crlf > 0 && (this.lf || c.lf > c.crlf))) u = lineEndsToLf(u);
    const lfAll = c.lf;
    const cr = c.cr;
    const firstLine = this.line;
    this.line += lfAll + cr;
    return { bytes: u, firstLine, hasNul: u.indexOf(0) >= 0, last };
  }
}

/** The encoding prepareText reads a whole buffer in (BOM excluded): UTF-8 when it is valid UTF-8, else windows-1252. */
export function encodingOf(bytes: Uint8Array): 'utf-8' | 'windows-1252' {
  const u = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? bytes.subarray(3) : bytes;
  return isValidUtf8(u) ? 'utf-8' : 'windows-1252';
}

/**
 * Feed a whole buffer through a splitter in one piece (the in-memory form of a stream): its blocks.
 * @example splitWhole(Buffer.from('a\nb')).map((b) => b.firstLine) // [1, 2]
 */
export function splitWhole(bytes: Uint8Array, splitter: LineSplitter): TextBlock[] {
  const out: TextBlock[] = [];
  const b = splitter.push(bytes);
  if (b) out.push(b);
  const e = splitter.end();
  if (e) out.push(e);
  return out;
}
