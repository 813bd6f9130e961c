// Bytes → text. UTF-8 (with or without a byte order mark) is tried first; `auto` falls back to
// Windows-1252, the usual encoding of files written by Windows instrument PCs, when the bytes
// are not valid UTF-8. A UTF-8 BOM followed by invalid bytes is refused rather than guessed,
// and a BOM wins over a profile that says Windows-1252.
import { layoutError } from './types.ts';
import { decodeWindows1252 } from './windows-1252.ts';

export type EncodingChoice = 'utf-8' | 'windows-1252' | 'auto';

export interface Decoded {
  text: string;
  encoding: 'utf-8' | 'windows-1252';
  bom: boolean;
}

const UTF8_BOM = [0xef, 0xbb, 0xbf];

function hasUtf8Bom(bytes: Uint8Array): boolean {
  return bytes.length >= 3 && UTF8_BOM.every((byte, i) => bytes[i] === byte);
}

function hasUtf16Bom(bytes: Uint8Array): boolean {
  return bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff));
}

function firstInvalidUtf8Line(bytes: Uint8Array): number {
  // Decode leniently and find the first replacement character to name its line.
  const text = new TextDecoder('utf-8').decode(bytes);
  const at = text.indexOf('\uFFFD');
  return at < 0 ? 1 : text.slice(0, at).split('\n').length;
}

export function decodeBytes(bytes: Uint8Array, choice: EncodingChoice = 'auto'): Decoded {
  if (hasUtf16Bom(bytes)) {
    throw layoutError('unsupported_encoding', 'The file is UTF-16; save it as UTF-8 or Windows-1252 (ANSI) text.', { line: 1 });
  }
  const bom = hasUtf8Bom(bytes);
  const body = bom ? bytes.subarray(3) : bytes;
  let decoded: Decoded;
  if (choice === 'windows-1252' && !bom) {
    decoded = { text: decodeWindows1252(body), encoding: 'windows-1252', bom };
  } else {
    try {
      decoded = { text: new TextDecoder('utf-8', { fatal: true }).decode(body), encoding: 'utf-8', bom };
    } catch {
      if (choice !== 'auto' || bom) {
        const line = firstInvalidUtf8Line(body);
        throw layoutError(
          'undecodable',
          `Line ${line} holds bytes that are not valid UTF-8${bom ? ' although the file starts with a UTF-8 byte order mark' : ''}.`,
          { line },
        );
      }
      decoded = { text: decodeWindows1252(body), encoding: 'windows-1252', bom };
    }
  }
  if (decoded.text.includes('\u0000')) {
    const line = decoded.text.slice(0, decoded.text.indexOf('\u0000')).split('\n').length;
    throw layoutError('binary_file', `Line ${line} holds a NUL byte: this is not a text result file.`, { line });
  }
  return decoded;
}
