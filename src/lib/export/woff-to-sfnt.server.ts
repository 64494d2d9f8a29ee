/**
 * Unpacks a WOFF 1.0 font into the plain TrueType/OpenType (sfnt) it wraps, following the W3C
 * WOFF File Format 1.0 recommendation (header, table directory, zlib-compressed tables).
 * fontkit can read WOFF itself, but inflates it in JavaScript on every document; unpacking once
 * per process with node:zlib makes each paper template several times faster.
 */
import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // "wOFF"
const WOFF_HEADER_BYTES = 44;
const WOFF_ENTRY_BYTES = 20;
const SFNT_HEADER_BYTES = 12;
const SFNT_ENTRY_BYTES = 16;

export function woffToSfnt(woff: Uint8Array): Uint8Array {
  const input = new DataView(woff.buffer, woff.byteOffset, woff.byteLength);
  if (input.getUint32(0) !== WOFF_SIGNATURE) throw new Error('not a WOFF 1.0 font');
  const flavor = input.getUint32(4);
  const numTables = input.getUint16(12);
  const tables = Array.from({ length: numTables }, (_, index) => {
    const at = WOFF_HEADER_BYTES + index * WOFF_ENTRY_BYTES;
    const offset = input.getUint32(at + 4);
    const compLength = input.getUint32(at + 8);
    const origLength = input.getUint32(at + 12);
    const stored = woff.subarray(offset, offset + compLength);
    return {
      tag: input.getUint32(at),
      checksum: input.getUint32(at + 16),
      data: compLength < origLength ? new Uint8Array(inflateSync(stored)) : stored,
    };
  });
  const padded = (length: number) => (length + 3) & ~3;
  let size = SFNT_HEADER_BYTES + numTables * SFNT_ENTRY_BYTES;
  for (const table of tables) size += padded(table.data.byteLength);
  const sfnt = new Uint8Array(size);
  const output = new DataView(sfnt.buffer);
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  output.setUint32(0, flavor);
  output.setUint16(4, numTables);
  output.setUint16(6, searchRange);
  output.setUint16(8, entrySelector);
  output.setUint16(10, numTables * 16 - searchRange);
  let offset = SFNT_HEADER_BYTES + numTables * SFNT_ENTRY_BYTES;
  tables.forEach((table, index) => {
    const at = SFNT_HEADER_BYTES + index * SFNT_ENTRY_BYTES;
    output.setUint32(at, table.tag);
    output.setUint32(at + 4, table.checksum);
    output.setUint32(at + 8, offset);
    output.setUint32(at + 12, table.data.byteLength);
    sfnt.set(table.data, offset);
    offset += padded(table.data.byteLength);
  });
  return sfnt;
}
