/**
 * Manuscripts are UTF-8. A file that is not (Latin-1, Windows-1252, a binary)
 * is refused at its first bad byte rather than decoded into U+FFFD
 * replacement characters that would then reach the built file.
 */
import type { Diagnostic } from '../core/diagnostics/diagnostic.ts';

/** Offset of the first byte that does not belong to a well-formed UTF-8 sequence, or undefined (RFC 3629, table 3-7 of Unicode). */
export function firstInvalidUtf8Byte(bytes: Uint8Array): number | undefined {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i]!;
    if (b < 0x80) {
      i++;
      continue;
    }
    let length: number;
    let low = 0x80;
    let high = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) length = 2;
    else if (b >= 0xe0 && b <= 0xef) {
      length = 3;
      if (b === 0xe0) low = 0xa0; // overlong
      if (b === 0xed) high = 0x9f; // surrogates
    } else if (b >= 0xf0 && b <= 0xf4) {
      length = 4;
      if (b === 0xf0) low = 0x90; // overlong
      if (b === 0xf4) high = 0x8f; // beyond U+10FFFF
    } else return i;
    for (let k = 1; k < length; k++) {
      const c = bytes[i + k];
      const [min, max] = k === 1 ? [low, high] : [0x80, 0xbf];
      if (c === undefined || c < min || c > max) return i;
    }
    i += length;
  }
  return undefined;
}

export type DecodedManuscript = { readonly ok: true; readonly text: string } | { readonly ok: false; readonly problem: Diagnostic };

/** The text of a manuscript's bytes, or an error at the first bad byte (line and column as editors count them). */
export function decodeManuscript(bytes: Uint8Array, displayPath: string): DecodedManuscript {
  const bad = firstInvalidUtf8Byte(bytes);
  if (bad === undefined) return { ok: true, text: Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('utf8') };
  const before = Buffer.from(bytes.buffer, bytes.byteOffset, bad).toString('utf8').replace(/^\uFEFF/, '');
  const lines = before.split(/\r\n|\n|\r/);
  const line = lines.length;
  const column = lines[line - 1]!.length + 1;
  const byte = bytes[bad]!.toString(16).toUpperCase().padStart(2, '0');
  return {
    ok: false,
    problem: {
      severity: 'error',
      ruleId: 'encoding-invalid',
      message: `${displayPath} is not valid UTF-8: the byte 0x${byte} here does not begin or continue a UTF-8 character, so nothing in the file was checked`,
      location: { file: displayPath, start: { line, column, offset: before.length } },
      hints: [
        'Save the file as UTF-8 (e.g. `iconv -f LATIN1 -t UTF-8 in.md > out.md`, or your editor\'s "save with encoding"); skeinproof reads manuscripts only as UTF-8.',
      ],
    },
  };
}
