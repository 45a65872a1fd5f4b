import { Unzip, UnzipInflate, UnzipPassThrough } from "fflate";
import { ImportFailure } from "./issues";
import { limits } from "./limits";

export type ZipEntry = { name: string; bytes: Uint8Array };

export function isZip(head: Uint8Array): boolean {
  return head.length >= 4 && head[0] === 0x50 && head[1] === 0x4b && head[2] === 0x03 && head[3] === 0x04;
}

/** True for names that could escape the folder they are unpacked into. */
export function unsafeEntryName(name: string): boolean {
  if (name.includes("\0") || name.includes("\\")) return true;
  if (name.startsWith("/") || /^[a-zA-Z]:/.test(name)) return true;
  return name.split("/").some((part) => part === "..");
}

type Limits = { maxEntries: number; maxTotal: number; maxEntry: number; maxRatio: number };

/**
 * Unpacks a zip in memory with guards: unsafe paths, too many entries, and decompression bombs
 * (counted on the bytes actually inflated, never on the sizes the archive claims).
 */
export function unzipSafely(bytes: Uint8Array, zipName: string, lim: Limits = { maxEntries: limits.zipMaxEntries, maxTotal: limits.zipMaxTotalBytes, maxEntry: limits.zipMaxEntryBytes, maxRatio: limits.zipMaxRatio }): ZipEntry[] {
  const out: ZipEntry[] = [];
  let total = 0;
  let count = 0;
  let failure: ImportFailure | null = null;
  const uz = new Unzip();
  uz.register(UnzipInflate);
  uz.register(UnzipPassThrough);
  uz.onfile = (file) => {
    if (failure) return;
    count += 1;
    if (count > lim.maxEntries) {
      failure = new ImportFailure(`\`${zipName}\` holds more than ${lim.maxEntries} entries; split it into smaller zips.`);
      return;
    }
    if (unsafeEntryName(file.name)) {
      failure = new ImportFailure(`\`${zipName}\` holds an entry with an unsafe path (\`${file.name}\`) that points outside the archive; nothing was imported. Re-create the zip from the image folder itself.`);
      return;
    }
    if (file.name.endsWith("/")) return;
    const parts: Uint8Array[] = [];
    let size = 0;
    const compressed = file.size ?? 0;
    file.ondata = (err, data, final) => {
      if (failure) return;
      if (err) {
        failure = new ImportFailure(`\`${zipName}\` is damaged: entry \`${file.name}\` could not be unpacked (${err.message}).`);
        return;
      }
      size += data.length;
      total += data.length;
      const bomb = size > lim.maxEntry || total > lim.maxTotal || (size > 1024 * 1024 && compressed > 0 && size / compressed > lim.maxRatio);
      if (bomb) {
        failure = new ImportFailure(`\`${zipName}\` looks like a decompression bomb: entry \`${file.name}\` inflates past ${size > lim.maxEntry ? `the ${Math.round(lim.maxEntry / 1048576)} MiB entry limit` : total > lim.maxTotal ? "the archive's total limit" : `${lim.maxRatio}× its packed size`}. Nothing was imported.`);
        file.terminate();
        return;
      }
      parts.push(data);
      if (final) {
        const joined = new Uint8Array(size);
        let at = 0;
        for (const p of parts) {
          joined.set(p, at);
          at += p.length;
        }
        out.push({ name: file.name, bytes: joined });
      }
    };
    try {
      file.start();
    } catch (error) {
      failure = new ImportFailure(`\`${zipName}\` uses a compression method Vicinal cannot unpack (entry \`${file.name}\`: ${(error as Error).message}).`);
    }
  };
  try {
    // Small compressed steps bound what one step can inflate (deflate tops out near 1 032 : 1).
    const step = 16 * 1024;
    for (let i = 0; i < bytes.length && !failure; i += step) uz.push(bytes.subarray(i, Math.min(bytes.length, i + step)), i + step >= bytes.length);
  } catch (error) {
    if (!failure) failure = new ImportFailure(`\`${zipName}\` is not a readable zip (${(error as Error).message}).`);
  }
  if (failure) throw failure;
  if (count === 0) throw new ImportFailure(`\`${zipName}\` holds no files, or is not a readable zip.`);
  return out.filter((e) => !e.name.split("/").some((p) => p.startsWith(".") || p === "__MACOSX"));
}
