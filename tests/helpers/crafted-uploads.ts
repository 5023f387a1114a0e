import { Zip, ZipDeflate } from "fflate";

/**
 * Workbooks written part by part in the test, as hostile uploads are: the XML of each part is
 * streamed through deflate, so a part that inflates to 100 MB never exists whole in the test
 * process either.
 */

const CONTENT_TYPES =
  '<?xml version="1.0" encoding="UTF-8"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/><Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/><Override PartName="/xl/worksheets/sheet1.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/></Types>';
const ROOT_RELS =
  '<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument" Target="xl/workbook.xml"/></Relationships>';
const NS = 'xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"';
const WORKBOOK = `<?xml version="1.0" encoding="UTF-8"?><workbook ${NS}><sheets><sheet name="Data" sheetId="1" r:id="rId1"/></sheets></workbook>`;
const WORKBOOK_RELS =
  '<?xml version="1.0" encoding="UTF-8"?><Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/></Relationships>';

const encoder = new TextEncoder();

/** A zip of the parts given; each part's text comes from an iterable of chunks. */
export function zipParts(parts: Record<string, Iterable<string>>): Uint8Array {
  const out: Uint8Array[] = [];
  const zip = new Zip((err, chunk) => {
    if (err) throw err;
    out.push(chunk);
  });
  for (const [name, chunks] of Object.entries(parts)) {
    const entry = new ZipDeflate(name, { level: 6 });
    zip.add(entry);
    for (const chunk of chunks) entry.push(encoder.encode(chunk));
    entry.push(new Uint8Array(0), true);
  }
  zip.end();
  const bytes = new Uint8Array(out.reduce((n, c) => n + c.length, 0));
  let at = 0;
  for (const c of out) bytes.set(c, (at += c.length) - c.length);
  return bytes;
}

/** A one-sheet workbook whose worksheet XML is the chunks given (inside `<sheetData>`). */
export function workbookOf(sheetData: Iterable<string>, extra: Record<string, Iterable<string>> = {}): Uint8Array {
  function* sheet() {
    yield `<?xml version="1.0" encoding="UTF-8"?><worksheet ${NS}><sheetData>`;
    yield* sheetData;
    yield "</sheetData></worksheet>";
  }
  return zipParts({ "[Content_Types].xml": [CONTENT_TYPES], "_rels/.rels": [ROOT_RELS], "xl/workbook.xml": [WORKBOOK], "xl/_rels/workbook.xml.rels": [WORKBOOK_RELS], "xl/worksheets/sheet1.xml": sheet(), ...extra });
}

const inline = (ref: string, text: string) => `<c r="${ref}" t="inlineStr"><is><t>${text}</t></is></c>`;
/** Column letters of a 1-based column number. */
export const columnName = (n: number): string => (n > 26 ? columnName(Math.floor((n - 1) / 26)) : "") + String.fromCharCode(65 + ((n - 1) % 26));

/** 40 header cells in row 1 and one data row numbered 1,048,576, the last row a worksheet has. */
export function sparseLastRowWorkbook(): Uint8Array {
  const header = Array.from({ length: 40 }, (_, i) => inline(`${columnName(i + 1)}1`, `h${i + 1}`)).join("");
  return workbookOf([`<row r="1">${header}</row>`, `<row r="1048576"><c r="A1048576"><v>1</v></c></row>`]);
}

/** A worksheet of inline text adding up to `chars` characters (100 MB compresses to ~100 kB). */
export function inlineTextWorkbook(chars = 100_000_000): Uint8Array {
  const perCell = 10_000;
  const text = "x".repeat(perCell);
  function* rows() {
    yield `<row r="1">${inline("A1", "tag")}${inline("B1", "type")}${inline("C1", "volume")}</row>`;
    for (let r = 2; (r - 1) * perCell <= chars; r++) yield `<row r="${r}">${inline(`A${r}`, text)}</row>`;
  }
  return workbookOf(rows());
}

/**
 * A worksheet part that inflates to `bytes` of blank space; when `declared` is given, the zip's
 * central directory says that size instead (a lying archive).
 */
export function zipBombWorkbook(bytes = 200_000_000, declared?: number): Uint8Array {
  const blank = " ".repeat(1_000_000);
  function* filler() {
    for (let n = 0; n < bytes; n += blank.length) yield blank;
  }
  const zip = workbookOf(filler());
  if (declared !== undefined) {
    // Central directory headers (PK\x01\x02) hold the uncompressed size at offset 24.
    const view = new DataView(zip.buffer, zip.byteOffset, zip.byteLength);
    for (let i = 0; i + 46 <= zip.length; i++) {
      if (view.getUint32(i, true) !== 0x02014b50) continue;
      const nameLength = view.getUint16(i + 28, true);
      const name = new TextDecoder().decode(zip.subarray(i + 46, i + 46 + nameLength));
      if (name === "xl/worksheets/sheet1.xml") view.setUint32(i + 24, declared, true);
    }
  }
  return zip;
}

/** An inventory of `n` vessels as CSV text. */
export function inventoryCsv(n: number): string {
  return ["tag,type,volume,unit", ...Array.from({ length: n }, (_, i) => `R-${i + 1},CSTR,${1 + (i % 10)},m3`)].join("\n");
}

/** The same inventory as a workbook. */
export function inventoryWorkbook(n: number): Uint8Array {
  function* rows() {
    yield `<row r="1">${inline("A1", "tag")}${inline("B1", "type")}${inline("C1", "volume")}</row>`;
    for (let i = 0; i < n; i++) yield `<row r="${i + 2}">${inline(`A${i + 2}`, `R-${i + 1}`)}${inline(`B${i + 2}`, "CSTR")}<c r="C${i + 2}"><v>${1 + (i % 10)}</v></c></row>`;
  }
  return workbookOf(rows());
}
