/**
 * Binary data as text an HTML `<script>` element keeps exactly, at 8 bits of file per 7 bits of data (base64 needs
 * 8 per 6): the bits are cut into 7-bit groups, and each group is one character, U+0000–U+007F, written as one UTF-8
 * byte. The three groups an HTML parser would change or act on — 0 (NUL becomes U+FFFD), 13 (CR becomes LF) and 60
 * (`<` can end the element) — are written together with the group after them as one character
 * U+0080–U+01FF: (k << 7) | next, k = 1, 2, 3 for 0, 13, 60, which UTF-8 writes in 2 bytes, so they cost nothing
 * extra. The last group is padded with zero bits; the reader stops at the byte count, given beside the text.
 * plotly-loader.js holds the matching reader.
 */

/** The 7-bit groups that never stand alone, in the order of their marks 1, 2, 3. */
export const SEVEN_BIT_ESCAPED = [0, 13, 60] as const;

/** Encodes `bytes` as seven-bit text (see the file comment). */
export function sevenBitText(bytes: Uint8Array): string {
  const groups: number[] = [];
  let buffer = 0;
  let bits = 0;
  for (const byte of bytes) {
    buffer = (buffer << 8) | byte;
    bits += 8;
    while (bits >= 7) {
      bits -= 7;
      groups.push((buffer >> bits) & 127);
    }
    buffer &= (1 << bits) - 1;
  }
  if (bits > 0) groups.push((buffer << (7 - bits)) & 127);
  const codes: number[] = [];
  for (let i = 0; i < groups.length; i++) {
    const g = groups[i]!;
    const mark = SEVEN_BIT_ESCAPED.indexOf(g as 0 | 13 | 60) + 1;
    if (mark === 0) codes.push(g);
    else codes.push((mark << 7) | (groups[++i] ?? 0));
  }
  let text = "";
  for (let i = 0; i < codes.length; i += 8192) text += String.fromCharCode(...codes.slice(i, i + 8192));
  return text;
}

/** Decodes seven-bit text back into `length` bytes (the same algorithm as plotly-loader.js, for tests and tools). */
export function bytesFromSevenBitText(text: string, length: number): Uint8Array {
  const out = new Uint8Array(length);
  let buffer = 0;
  let bits = 0;
  let at = 0;
  const push = (group: number) => {
    buffer = ((buffer << 7) | group) & 0x7fff;
    bits += 7;
    if (bits >= 8 && at < length) {
      bits -= 8;
      out[at++] = (buffer >> bits) & 255;
    }
  };
  for (let i = 0; i < text.length && at < length; i++) {
    const c = text.charCodeAt(i);
    if (c < 128) push(c);
    else {
      push(SEVEN_BIT_ESCAPED[(c >> 7) - 1]!);
      push(c & 127);
    }
  }
  if (at < length) throw new Error(`seven-bit text holds ${at} bytes, not ${length}`);
  return out;
}
