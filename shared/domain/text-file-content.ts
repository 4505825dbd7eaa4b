/**
 * The text of an uploaded text file (a logger export, a catalog CSV). Such files are UTF-8 (with or without a
 * byte-order mark) or, from some desktop software, UTF-16 with a byte-order mark. Returns null for anything with NUL
 * bytes and no UTF-16 mark: a binary file (a spreadsheet workbook, an image), not a text export. Bytes that are not
 * valid UTF-8 become U+FFFD, which the readers then refuse with the row they are on.
 */
export function textFileContent(bytes: Uint8Array): string | null {
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return new TextDecoder('utf-16le').decode(bytes.subarray(2));
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return new TextDecoder('utf-16be').decode(bytes.subarray(2));
  if (bytes.includes(0)) return null;
  // TextDecoder drops a leading UTF-8 byte-order mark by default.
  return new TextDecoder('utf-8').decode(bytes);
}
