/**
 * The frontogenesis fields (θ, u, v per report) of a streamed run, kept in a temporary file instead of memory:
 * each station's four columns are written as they arrive and read back, one station at a time, when the fronts
 * are known (withFrontogenesisFields). The values are the same bytes, so results do not change. When no
 * temporary file can be written, the fields stay in memory. The file has no name once open (removed at once,
 * read and written through its descriptor), so nothing is left behind when a run is killed.
 */
import { closeSync, mkdtempSync, openSync, readSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { StationFields, StationFieldsRef } from '../network/frontogenesis.js';

export class FieldSpill {
  private dir: string | null = null;
  private fd: number | null = null;
  private at = 0;

  constructor() {
    try {
      this.dir = mkdtempSync(join(tmpdir(), 'fropa-fields-'));
      this.fd = openSync(join(this.dir, 'fields.f64'), 'w+');
    } catch {
      this.close();
      return;
    }
    // The file is removed from its folder at once and used through the open descriptor (POSIX), so a run that is
    // killed leaves nothing behind; where an open file cannot be removed (Windows), close() removes it.
    try {
      rmSync(this.dir, { recursive: true, force: true });
      this.dir = null;
    } catch {
      // kept until close()
    }
  }

  /** Keep one station's fields; what frontogenesis is given for it (a reference, or the fields when the file failed). */
  keep(f: StationFields): StationFields | StationFieldsRef {
    const fd = this.fd;
    if (fd === null) return f;
    const n = f.timeMs.length;
    const start = this.at;
    try {
      for (const a of [f.timeMs, f.thetaK, f.uMs, f.vMs]) {
        const bytes = new Uint8Array(a.buffer, a.byteOffset, n * 8);
        for (let off = 0; off < bytes.length; ) off += writeSync(fd, bytes, off, bytes.length - off, this.at + off);
        this.at += bytes.length;
      }
    } catch {
      this.at = start;
      return f;
    }
    const meta = f.meta;
    return {
      meta,
      load: () => {
        const buf = new Float64Array(n * 4);
        const bytes = new Uint8Array(buf.buffer);
        for (let off = 0; off < bytes.length; ) {
          const k = readSync(fd, bytes, off, bytes.length - off, start + off);
          if (k === 0) throw new Error('the temporary file of the frontogenesis fields ended early');
          off += k;
        }
        return { meta, timeMs: buf.subarray(0, n), thetaK: buf.subarray(n, 2 * n), uMs: buf.subarray(2 * n, 3 * n), vMs: buf.subarray(3 * n) };
      },
    };
  }

  /** Remove the temporary file. */
  close(): void {
    if (this.fd !== null) closeSync(this.fd);
    this.fd = null;
    if (this.dir !== null) rmSync(this.dir, { recursive: true, force: true });
    this.dir = null;
  }
}
