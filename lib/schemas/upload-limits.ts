/**
 * The limits of every file upload (rate data and vessel inventory), in one place so the checks,
 * the messages and the screens say the same numbers. Plain constants: the browser imports them too.
 */
export const UPLOAD_LIMITS = {
  /** The file as sent, bytes. */
  bytes: 2_000_000,
  /** Data rows (the header excluded), CSV and XLSX alike. */
  rows: 20_000,
  /** XLSX: the highest worksheet row number read; a sheet reaching further is refused unread. */
  sheetRows: 100_000,
  /** XLSX: the highest worksheet column number read (column IV). */
  sheetColumns: 256,
  /** XLSX: cells holding a value in the worksheet. */
  cells: 500_000,
  /** XLSX: characters of text in the workbook (shared and in-cell text together). */
  textChars: 8_000_000,
  /** XLSX: bytes of any one part of the workbook once inflated (a workbook is a zip archive). */
  partBytes: 40_000_000,
} as const;

/** "2 MB", "20,000": the limits as the messages and screens print them. */
export const formatLimit = (n: number) => n.toLocaleString("en");
export const MAX_FILE_MB = `${UPLOAD_LIMITS.bytes / 1e6} MB`;

/**
 * A whole upload request: the file plus room for the text parts and part headers beside it (a
 * mapping of 100 columns is ~25 kB). The proxy refuses a larger declared body, the multipart
 * reader a larger streamed one, with the same answer.
 */
export const UPLOAD_BODY_BYTES = UPLOAD_LIMITS.bytes + 256_000;
