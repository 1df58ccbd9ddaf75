// WOFF 1.0 → TrueType (sfnt). fontkit reads WOFF, but inflates a table again on every access,
// which made one report take seconds; its WOFF2 path breaks pdfkit's subsetting of composite
// glyphs. Decoding once with node:zlib and handing pdfkit plain TrueType avoids both.
// Format: W3C "WOFF File Format 1.0", sections 3–5.
import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // 'wOFF'
const HEADER_SIZE = 44;
const DIRECTORY_ENTRY_SIZE = 20;

/** Rebuild the sfnt that a WOFF 1.0 file wraps; throws naming the problem for anything else. */
export function decodeWoff(woff: Buffer): Buffer {
  if (woff.length < HEADER_SIZE || woff.readUInt32BE(0) !== WOFF_SIGNATURE)
    throw new Error('not a WOFF 1.0 font (no wOFF signature)');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i += 1) {
    const at = HEADER_SIZE + i * DIRECTORY_ENTRY_SIZE;
    const tag = woff.readUInt32BE(at);
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const checksum = woff.readUInt32BE(at + 16);
    const stored = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(stored) : Buffer.from(stored);
    if (data.length !== origLength)
      throw new Error(`WOFF table ${i} inflates to ${data.length} bytes, expected ${origLength}`);
    tables.push({ tag, checksum, data });
  }
  tables.sort((a, b) => a.tag - b.tag);

  const pad4 = (n: number) => (n + 3) & ~3;
  const directorySize = 12 + 16 * numTables;
  const total = tables.reduce((sum, t) => sum + pad4(t.data.length), directorySize);
  const out = Buffer.alloc(total);
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = directorySize;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
    offset += pad4(t.data.length);
  });
  return out;
}
