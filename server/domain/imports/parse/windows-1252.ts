// Windows-1252 → text. Node 20.18.3 and later decode the "windows-1252" label as Latin-1
// (nodejs/node#60888), turning 0x80–0x9F into control characters instead of €, ’, –, Ÿ …
// Windows-1252 is Latin-1 except for that block, so we map it ourselves from the WHATWG
// Encoding Standard's index-windows-1252 (the five unassigned bytes keep their C1 code points).
const HIGH_BLOCK = [
  0x20ac, 0x0081, 0x201a, 0x0192, 0x201e, 0x2026, 0x2020, 0x2021, 0x02c6, 0x2030, 0x0160, 0x2039, 0x0152, 0x008d, 0x017d, 0x008f, 0x0090,
  0x2018, 0x2019, 0x201c, 0x201d, 0x2022, 0x2013, 0x2014, 0x02dc, 0x2122, 0x0161, 0x203a, 0x0153, 0x009d, 0x017e, 0x0178,
].map((code) => String.fromCharCode(code));

export function decodeWindows1252(bytes: Uint8Array): string {
  const latin1 = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('latin1');
  return latin1.replace(/[\u0080-\u009f]/g, (ch) => HIGH_BLOCK[ch.charCodeAt(0) - 0x80]);
}
