// How much an .xlsx (a zip) holds once unpacked, read off its central directory before anything is
// unpacked: a 20 MB workbook can hold gigabytes of repeated cells, and exceljs unpacks in memory.
// Zip layout: PKWARE APPNOTE.TXT, sections 4.3.12 (central directory header) and 4.3.16 (end of
// central directory record).

const END_SIGNATURE = 0x06054b50;
const ENTRY_SIGNATURE = 0x02014b50;
/** The end record is 22 bytes plus a comment of at most 65,535. */
const END_SEARCH = 22 + 0xffff;

export type ZipSize = { entries: number; unpackedBytes: number } | { problem: string };

export function zipUnpackedSize(bytes: Uint8Array): ZipSize {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let end = -1;
  for (let i = bytes.length - 22; i >= 0 && i >= bytes.length - END_SEARCH; i -= 1) {
    if (view.getUint32(i, true) === END_SIGNATURE) {
      end = i;
      break;
    }
  }
  if (end < 0) return { problem: "not a zip archive" };
  const entries = view.getUint16(end + 10, true);
  let offset = view.getUint32(end + 16, true);
  let unpackedBytes = 0;
  // One step per entry the record announces, each moving forward: bounded by 65,535.
  for (let n = 0; n < entries; n += 1) {
    if (offset + 46 > bytes.length || view.getUint32(offset, true) !== ENTRY_SIGNATURE) {
      return { problem: "its table of contents is damaged" };
    }
    const size = view.getUint32(offset + 24, true);
    // 0xFFFFFFFF means the size is in a ZIP64 field: more than 4 GB, far past any limit.
    if (size === 0xffffffff) return { problem: "it holds a part larger than 4 GB" };
    unpackedBytes += size;
    offset += 46 + view.getUint16(offset + 28, true) + view.getUint16(offset + 30, true) + view.getUint16(offset + 32, true);
  }
  return { entries, unpackedBytes };
}
