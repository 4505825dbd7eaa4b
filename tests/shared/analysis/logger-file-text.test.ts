import { describe, expect, it } from 'vitest';
import { loggerFileText } from '../../../shared/domain/analysis/logger-file-text';

// Byte-order marks from the Unicode Standard, §23.8 (FF FE: UTF-16LE, FE FF: UTF-16BE, EF BB BF: UTF-8).
const header = 'Elapsed (s);VRM 1 (°C)\n0;40,5\n';

describe('reading the text of a logger export', () => {
  it('reads UTF-8 with and without a byte-order mark the same', () => {
    const plain = new TextEncoder().encode(header);
    expect(loggerFileText(plain)).toBe(header);
    expect(loggerFileText(new Uint8Array([0xef, 0xbb, 0xbf, ...plain]))).toBe(header);
  });

  it('reads UTF-16 in either byte order when the file starts with its mark', () => {
    const units = [...header].map((c) => c.charCodeAt(0));
    const little = new Uint8Array([0xff, 0xfe, ...units.flatMap((u) => [u & 0xff, u >> 8])]);
    const big = new Uint8Array([0xfe, 0xff, ...units.flatMap((u) => [u >> 8, u & 0xff])]);
    expect(loggerFileText(little)).toBe(header);
    expect(loggerFileText(big)).toBe(header);
  });

  it('when a spreadsheet or image is uploaded instead (NUL bytes, no UTF-16 mark), then it is not read as text', () => {
    // A ZIP container (office spreadsheets) starts with "PK\x03\x04" and holds NUL bytes: PKWARE APPNOTE §4.3.7.
    expect(loggerFileText(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00]))).toBeNull();
  });
});
