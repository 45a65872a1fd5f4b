import { ImportFailure } from "./issues";

/** Offset of the first byte that breaks UTF-8 in `buf`, or -1 (a sequence cut at the end is not an error). */
export function firstInvalidUtf8(buf: Uint8Array): number {
  let i = 0;
  const n = buf.length;
  while (i < n) {
    const b = buf[i];
    if (b < 0x80) { i += 1; continue; }
    let need: number;
    let min: number;
    if (b >= 0xc2 && b <= 0xdf) { need = 1; min = 0x80; }
    else if (b >= 0xe0 && b <= 0xef) { need = 2; min = 0x800; }
    else if (b >= 0xf0 && b <= 0xf4) { need = 3; min = 0x10000; }
    else return i;
    let cp = b & (0x3f >> need);
    for (let k = 1; k <= need; k += 1) {
      if (i + k >= n) return -1;
      const c = buf[i + k];
      if ((c & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (c & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += need + 1;
  }
  return -1;
}

/**
 * Decodes a byte stream as UTF-8 (a leading BOM is dropped); invalid bytes stop the import with the byte offset.
 * UTF-16 files (by their BOM) get their own message.
 */
export class Utf8Decoder {
  private decoder = new TextDecoder("utf-8", { fatal: true, ignoreBOM: false });
  private offset = 0;
  private first = true;

  decode(chunk: Uint8Array, final = false): string {
    if (this.first && chunk.length >= 2) {
      this.first = false;
      if ((chunk[0] === 0xff && chunk[1] === 0xfe) || (chunk[0] === 0xfe && chunk[1] === 0xff)) {
        throw new ImportFailure("The file is encoded as UTF-16. Save it as UTF-8 (with or without BOM) and upload it again.");
      }
    }
    try {
      const text = this.decoder.decode(chunk, { stream: !final });
      this.offset += chunk.length;
      return text;
    } catch {
      const at = firstInvalidUtf8(chunk);
      const where = this.offset + Math.max(at, 0);
      throw new ImportFailure(
        `The file is not valid UTF-8 (the first bad byte, 0x${chunk[Math.max(at, 0)]?.toString(16).padStart(2, "0") ?? "??"}, is at byte ${where}). It may be saved as Latin-1 or Windows-1252: save it as UTF-8 and upload it again.`,
      );
    }
  }

  end(): string {
    try {
      return this.decoder.decode();
    } catch {
      throw new ImportFailure("The file ends in the middle of a UTF-8 character. Save it as UTF-8 and upload it again.");
    }
  }
}
