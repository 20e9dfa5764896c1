/**
 * The shipped fonts for exports, from @fontsource in node_modules (no
 * system fonts, no network): Inter regular and bold for text, JetBrains Mono
 * for counts. pdfkit reads the WOFF files directly (it cannot read WOFF2).
 * The SVG rasteriser (resvg) reads TrueType/OpenType only, so the WOFF files
 * are unpacked to plain sfnt files once per process (WOFF 1.0: a table
 * directory with each table zlib-compressed when that made it smaller).
 */
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import os from 'node:os';
import path from 'node:path';
import { inflateSync } from 'node:zlib';

const require = createRequire(import.meta.url);

/** Our fonts by role. */
export type FontRole = 'regular' | 'bold' | 'mono';

const FILES: Readonly<Record<FontRole, string>> = {
  regular: '@fontsource/inter/files/inter-latin-400-normal.woff',
  bold: '@fontsource/inter/files/inter-latin-700-normal.woff',
  mono: '@fontsource/jetbrains-mono/files/jetbrains-mono-latin-400-normal.woff',
};

/** Absolute path of a shipped WOFF file. */
export function woffPath(role: FontRole): string {
  return require.resolve(FILES[role]);
}

/**
 * Converts WOFF 1.0 bytes to an sfnt (TrueType/OpenType) font. Throws on
 * anything that is not WOFF 1.0 (a programmer error: we ship the files).
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.readUInt32BE(0) !== 0x774f4646) throw new Error('not a WOFF 1.0 file');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = 44 + i * 20;
    const tag = woff.readUInt32BE(at);
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const checksum = woff.readUInt32BE(at + 16);
    const raw = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(raw) : Buffer.from(raw);
    if (data.length !== origLength) throw new Error('WOFF table has the wrong length');
    tables.push({ tag, checksum, data });
  }
  tables.sort((a, b) => a.tag - b.tag);
  let pow = 1;
  while (pow * 2 <= numTables) pow *= 2;
  const headerSize = 12 + numTables * 16;
  const padded = (n: number) => (n + 3) & ~3;
  const total = tables.reduce((sum, t) => sum + padded(t.data.length), headerSize);
  const out = Buffer.alloc(total);
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(pow * 16, 6);
  out.writeUInt16BE(Math.log2(pow), 8);
  out.writeUInt16BE(numTables * 16 - pow * 16, 10);
  let offset = headerSize;
  tables.forEach((t, i) => {
    const rec = 12 + i * 16;
    out.writeUInt32BE(t.tag, rec);
    out.writeUInt32BE(t.checksum, rec + 4);
    out.writeUInt32BE(offset, rec + 8);
    out.writeUInt32BE(t.data.length, rec + 12);
    t.data.copy(out, offset);
    offset += padded(t.data.length);
  });
  return out;
}

let sfntFiles: string[] | null = null;

/**
 * Paths of the shipped fonts as sfnt files for resvg, unpacked on first use
 * into `<tmp>/loopwright-fonts/` (or `dir`).
 */
export function sfntFontFiles(dir = path.join(os.tmpdir(), 'loopwright-fonts')): string[] {
  if (sfntFiles) return sfntFiles;
  mkdirSync(dir, { recursive: true });
  sfntFiles = (Object.keys(FILES) as FontRole[]).map((role) => {
    const file = path.join(dir, `${path.basename(FILES[role], '.woff')}.ttf`);
    if (!existsSync(file)) {
      // Write to a unique name, then rename, so two processes never read half a file.
      const tmp = `${file}.${process.pid}.tmp`;
      writeFileSync(tmp, woffToSfnt(readFileSync(woffPath(role))));
      renameSync(tmp, file);
    }
    return file;
  });
  return sfntFiles;
}
