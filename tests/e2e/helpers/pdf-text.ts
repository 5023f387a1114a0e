import { PDFParse } from "pdf-parse";

/** The text of a PDF with its line breaks joined, so a sentence wrapped across lines is found whole. */
export async function pdfText(buf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(buf) });
  try {
    return (await parser.getText()).text.replace(/\s+/g, " ");
  } finally {
    await parser.destroy();
  }
}
