/** Reading a text with the byte group decoders. */

/** Scratch for asciiView (grown as needed). */
let VIEW = new Uint8Array(256);

/**
 * The characters of s[0, end + 2) as bytes at the same indices (characters above 127 become 255, past
 * the text 0), so that the byte group decoders read a text exactly as char-code tests would: no group
 * accepts a character above 127. Shared scratch: valid until the next call.
 */
export function asciiView(s: string, end: number): Uint8Array {
  const n = end + 2;
  if (VIEW.length < n) VIEW = new Uint8Array(Math.max(n, VIEW.length * 2));
  const v = VIEW;
  const m = Math.min(n, s.length);
  for (let i = 0; i < m; i++) {
    const c = s.charCodeAt(i);
    v[i] = c > 127 ? 255 : c;
  }
  for (let i = m; i < n; i++) v[i] = 0;
  return v;
}

/** The characters of s as fresh bytes (characters above 127 become 255), for one-off reads. */
export function asciiBytes(s: string): Uint8Array {
  const v = new Uint8Array(s.length);
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    v[i] = c > 127 ? 255 : c;
  }
  return v;
}
