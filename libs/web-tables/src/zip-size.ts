/**
 * What a zip (an XLSX workbook) says it unpacks to, read from its central directory without
 * unpacking anything: a few megabytes of workbook can otherwise expand to gigabytes of XML.
 * Returns undefined when the directory cannot be read (the workbook reader then refuses the file).
 */
export function declaredUnpackedBytes(zip: Uint8Array): number | undefined {
  const view = new DataView(zip.buffer, zip.byteOffset, zip.byteLength);
  // The end-of-central-directory record: 22 bytes plus a comment of up to 65,535.
  for (let end = zip.byteLength - 22; end >= Math.max(0, zip.byteLength - 22 - 65_535); end--) {
    if (view.getUint32(end, true) !== 0x06054b50) continue;
    const entries = view.getUint16(end + 10, true);
    let at = view.getUint32(end + 16, true);
    let total = 0;
    for (let k = 0; k < entries; k++) {
      if (at + 46 > zip.byteLength || view.getUint32(at, true) !== 0x02014b50) return undefined;
      const unpacked = view.getUint32(at + 24, true);
      // 0xffffffff: the real size is in a zip64 field; count it as too large to take.
      total += unpacked === 0xffffffff ? Number.POSITIVE_INFINITY : unpacked;
      at += 46 + view.getUint16(at + 28, true) + view.getUint16(at + 30, true) + view.getUint16(at + 32, true);
    }
    return total;
  }
  return undefined;
}
