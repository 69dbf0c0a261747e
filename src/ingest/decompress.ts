/**
 * Compressed inputs: gzip (RFC 1952) is expanded, with a bound on the expansion against decompression
 * bombs; other compressed or archive formats are recognised by their magic bytes and refused with a
 * message. Magic numbers: gzip 1F 8B (RFC 1952 §2.3.1); zip `PK\x03\x04` (PKWARE APPNOTE 4.3.7); xz
 * FD 37 7A 58 5A 00 (xz file format 1.0.4 §2.1.1.1); bzip2 `BZh` (common practice, no source); zstd
 * 28 B5 2F FD (RFC 8878 §3.1.1); 7z 37 7A BC AF 27 1C (from memory).
 */
import { gunzipSync } from 'node:zlib';
import { Gunzip } from 'fflate';

/** Expanded bytes may be at most this many times the compressed size (text compresses about 5–20×). */
export const MAX_EXPANSION_RATIO = 200;
/** And never more than this many bytes in all (1 GiB). */
export const MAX_EXPANDED_BYTES = 1 << 30;

export type CompressionKind = 'gzip' | 'zip' | 'xz' | 'bzip2' | 'zstd' | '7z' | null;

/**
 * The compression a file's first bytes announce, or null.
 * @example compressionOf(Buffer.from([0x1f, 0x8b, 8, 0])) // 'gzip'
 */
export function compressionOf(head: Uint8Array): CompressionKind {
  const b = (i: number) => head[i];
  if (b(0) === 0x1f && b(1) === 0x8b) return 'gzip';
  if (b(0) === 0x50 && b(1) === 0x4b && b(2) === 0x03 && b(3) === 0x04) return 'zip';
  if (b(0) === 0xfd && b(1) === 0x37 && b(2) === 0x7a && b(3) === 0x58 && b(4) === 0x5a && b(5) === 0x00) return 'xz';
  if (b(0) === 0x42 && b(1) === 0x5a && b(2) === 0x68 && b(3)! >= 0x31 && b(3)! <= 0x39) return 'bzip2';
  if (b(0) === 0x28 && b(1) === 0xb5 && b(2) === 0x2f && b(3) === 0xfd) return 'zstd';
  if (b(0) === 0x37 && b(1) === 0x7a && b(2) === 0xbc && b(3) === 0xaf && b(4) === 0x27 && b(5) === 0x1c) return '7z';
  return null;
}

/** Why a compressed input was not expanded. */
export interface DecompressRefusal {
  reason: 'compressed-format' | 'decompression-bomb' | 'bad-gzip';
  message: string;
}

/** The expansion bound for a compressed size. */
export function expansionLimit(compressedBytes: number, maxRatio = MAX_EXPANSION_RATIO, maxBytes = MAX_EXPANDED_BYTES): number {
  return Math.min(maxBytes, Math.max(1 << 16, compressedBytes * maxRatio));
}

/**
 * Expand a gzip file's bytes (several members are read as one, RFC 1952 §2.2), refusing more than
 * `expansionLimit` bytes of output; other compression kinds are refused with a message naming the tool
 * to use. Bytes that are not compressed come back as they are.
 * @example expandBytes(gzipSync('a,b\n')).bytes.toString() // 'a,b\n'
 */
export function expandBytes(bytes: Buffer, opts: { maxRatio?: number; maxBytes?: number } = {}): { bytes: Buffer; kind: CompressionKind } | DecompressRefusal {
  const kind = compressionOf(bytes);
  if (kind === null) return { bytes, kind };
  if (kind !== 'gzip') {
    return { reason: 'compressed-format', message: `${kind} compressed file: fropa expands only gzip; extract it first (e.g. ${TOOL[kind]}) and read the extracted files` };
  }
  const limit = expansionLimit(bytes.length, opts.maxRatio, opts.maxBytes);
  try {
    return { bytes: gunzipSync(bytes, { maxOutputLength: limit }), kind };
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    if (err.code === 'ERR_BUFFER_TOO_LARGE' || err instanceof RangeError) {
      return { reason: 'decompression-bomb', message: `gzip expands to more than ${limit} bytes (${Math.round(limit / Math.max(1, bytes.length))}× its ${bytes.length} bytes): refused as a possible decompression bomb` };
    }
    return { reason: 'bad-gzip', message: `gzip data is damaged (${err.message}); the file may be cut short` };
  }
}

const TOOL: Record<Exclude<CompressionKind, 'gzip' | null>, string> = { zip: 'unzip', xz: 'xz -d', bzip2: 'bunzip2', zstd: 'zstd -d', '7z': '7z x' };

/**
 * A gzip file expanded piece by piece, synchronously (fflate's streaming Gunzip; several members are read as one,
 * RFC 1952 §2.2): `push` takes the next compressed piece and gives back the expanded bytes it completes. It
 * throws a {@link GzipStreamError} once the output passes `maxRatio` × the compressed bytes read so far plus
 * 64 KiB (a decompression bomb), or when the data is damaged. Memory holds one piece, not the file, so there is
 * no bound on the total.
 */
export class GunzipPieces {
  private readonly g: Gunzip;
  private readonly maxRatio: number;
  private inBytes = 0;
  private outBytes = 0;
  private out: Buffer[] = [];

  constructor(maxRatio = MAX_EXPANSION_RATIO) {
    this.maxRatio = maxRatio;
    this.g = new Gunzip((data) => {
      this.outBytes += data.length;
      this.out.push(Buffer.from(data.buffer, data.byteOffset, data.length));
    });
  }

  /** Expand the next compressed piece (`final` for the last); returns the expanded bytes, possibly none. */
  push(piece: Uint8Array, final = false): Buffer[] {
    this.inBytes += piece.length;
    try {
      this.g.push(piece, final);
    } catch (e) {
      throw new GzipStreamError('bad-gzip', `gzip data is damaged (${(e as Error).message}); the file may be cut short`);
    }
    if (this.outBytes > this.inBytes * this.maxRatio + (1 << 16)) {
      throw new GzipStreamError(
        'decompression-bomb',
        `gzip expands more than ${this.maxRatio}× (${this.outBytes} bytes from the first ${this.inBytes}): refused as a possible decompression bomb`,
      );
    }
    const got = this.out;
    this.out = [];
    return got;
  }
}

/** Why a streamed gzip file stopped expanding. */
export class GzipStreamError extends Error {
  readonly reason: 'bad-gzip' | 'decompression-bomb';
  constructor(reason: 'bad-gzip' | 'decompression-bomb', message: string) {
    super(message);
    this.reason = reason;
  }
}
