// Pins the modification date/time of every entry in a ZIP container (an XLSX) so the same input
// gives the same bytes. Field offsets from PKWARE's APPNOTE.TXT (local header 4.3.7, central
// directory header 4.3.12, end of central directory 4.3.16); MS-DOS date/time encoding.

/** MS-DOS date and time (2-second resolution) for an ISO date string; 1980-01-01 if unreadable. */
export function dosDateTime(iso: string): { date: number; time: number } {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime()) || d.getUTCFullYear() < 1980 || d.getUTCFullYear() > 2107) return { date: (1 << 5) | 1, time: 0 };
  return {
    date: ((d.getUTCFullYear() - 1980) << 9) | ((d.getUTCMonth() + 1) << 5) | d.getUTCDate(),
    time: (d.getUTCHours() << 11) | (d.getUTCMinutes() << 5) | Math.floor(d.getUTCSeconds() / 2),
  };
}

/** Returns a copy of the ZIP with every entry's date/time set; the input unchanged if it is not a plain ZIP. */
export function pinZipTimes(zip: Uint8Array, iso: string): Uint8Array {
  const out = zip.slice();
  const v = new DataView(out.buffer, out.byteOffset, out.byteLength);
  let eocd = -1;
  for (let i = out.length - 22; i >= Math.max(0, out.length - 22 - 0xffff); i--) {
    if (v.getUint32(i, true) === 0x06054b50) { eocd = i; break; }
  }
  if (eocd < 0) return zip;
  const { date, time } = dosDateTime(iso);
  const entries = v.getUint16(eocd + 10, true);
  let p = v.getUint32(eocd + 16, true);
  for (let k = 0; k < entries; k++) {
    if (p + 46 > out.length || v.getUint32(p, true) !== 0x02014b50) return zip;
    v.setUint16(p + 12, time, true);
    v.setUint16(p + 14, date, true);
    const local = v.getUint32(p + 42, true);
    if (local + 30 > out.length || v.getUint32(local, true) !== 0x04034b50) return zip;
    v.setUint16(local + 10, time, true);
    v.setUint16(local + 12, date, true);
    p += 46 + v.getUint16(p + 28, true) + v.getUint16(p + 30, true) + v.getUint16(p + 32, true);
  }
  return out;
}
