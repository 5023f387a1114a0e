import { StringDecoder } from "node:string_decoder";
import yauzl from "yauzl";
import { formatLimit, UPLOAD_LIMITS } from "@/lib/schemas/upload-limits";

/** A workbook we will not read, with the reason in the user's words. */
export class WorkbookRefused extends Error {}

export const UNREADABLE = "The file is not a readable XLSX workbook";
/** More entries than any spreadsheet has; past it the archive is not a workbook we read. */
const MAX_ENTRIES = 10_000;

const tooBig = () => new WorkbookRefused(`A part of the workbook unpacks to more than ${formatLimit(UPLOAD_LIMITS.partBytes / 1e6)} MB; it was not read`);

export interface WorkbookZip {
  has(name: string): boolean;
  /** Inflates one part, handing its text on chunk by chunk; stops at the size limit while inflating. */
  read(name: string, onText: (text: string) => void): Promise<void>;
}

/** Opens the zip archive of an XLSX workbook held in memory (its central directory only). */
export function openWorkbookZip(data: Uint8Array): Promise<WorkbookZip> {
  const buffer = Buffer.from(data.buffer, data.byteOffset, data.byteLength);
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(buffer, { lazyEntries: true, validateEntrySizes: true, decodeStrings: true }, (err, zip) => {
      if (err || !zip) return reject(new WorkbookRefused(UNREADABLE));
      const entries = new Map<string, yauzl.Entry>();
      zip.on("entry", (entry: yauzl.Entry) => {
        if (entries.size >= MAX_ENTRIES) return reject(new WorkbookRefused(UNREADABLE));
        entries.set(entry.fileName, entry);
        zip.readEntry();
      });
      zip.on("error", () => reject(new WorkbookRefused(UNREADABLE)));
      zip.on("end", () => resolve({ has: (name) => entries.has(name), read: (name, onText) => inflate(zip, entries.get(name), onText) }));
      zip.readEntry();
    });
  });
}

function inflate(zip: yauzl.ZipFile, entry: yauzl.Entry | undefined, onText: (text: string) => void): Promise<void> {
  if (!entry) return Promise.reject(new WorkbookRefused(UNREADABLE));
  // The declared size is checked first; the count below holds when the declaration lies.
  if (entry.uncompressedSize > UPLOAD_LIMITS.partBytes) return Promise.reject(tooBig());
  return new Promise((resolve, reject) => {
    zip.openReadStream(entry, (err, stream) => {
      if (err || !stream) return reject(new WorkbookRefused(UNREADABLE));
      const decoder = new StringDecoder("utf8");
      let bytes = 0;
      let stopped = false;
      const stop = (e: unknown) => {
        if (stopped) return;
        stopped = true;
        stream.destroy();
        reject(e instanceof WorkbookRefused ? e : new WorkbookRefused(UNREADABLE));
      };
      stream.on("data", (chunk: Buffer) => {
        if (stopped) return;
        bytes += chunk.length;
        if (bytes > UPLOAD_LIMITS.partBytes) return stop(tooBig());
        try {
          onText(decoder.write(chunk));
        } catch (e) {
          stop(e);
        }
      });
      // yauzl stops a part that inflates past the size its archive declares: a lying archive.
      stream.on("error", (e) => stop(/too many bytes/i.test(String(e)) ? tooBig() : e));
      stream.on("end", () => {
        if (stopped) return;
        try {
          onText(decoder.end());
          resolve();
        } catch (e) {
          stop(e);
        }
      });
    });
  });
}
