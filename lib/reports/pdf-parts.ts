/**
 * The drawing pieces every page of the design report PDF uses (pdfkit): page geometry, headings,
 * label-value pairs, paragraphs, tables that carry their heading onto the next page, chart axes.
 */
import { ticks } from "@/lib/charts/levenspiel-geometry";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";
import type { WordLine } from "./kinetics-words";

export const INK = "#1c2430";
export const SOFT = "#4a5565";
export const LINE = "#c9ced6";
export const MARGIN = 50;
export const FOOTER = 30;

export type Doc = PDFKit.PDFDocument;

export const width = (doc: Doc) => doc.page.width - MARGIN * 2;
export const bottom = (doc: Doc) => doc.page.height - MARGIN - FOOTER;

export function ensureSpace(doc: Doc, h: number) {
  if (doc.y + h > bottom(doc)) doc.addPage();
}

export function heading(doc: Doc, text: string) {
  ensureSpace(doc, 60);
  doc.moveDown(0.6).font("bold").fontSize(12.5).fillColor(INK).text(text, MARGIN, doc.y);
  doc.moveTo(MARGIN, doc.y + 1).lineTo(MARGIN + width(doc), doc.y + 1).lineWidth(0.5).strokeColor(LINE).stroke();
  doc.moveDown(0.4).font("body").fontSize(9.5);
}

/** Label: value lines in two columns. */
export function pairs(doc: Doc, lines: WordLine[]) {
  const labelW = 170;
  for (const l of lines) {
    const h = Math.max(doc.heightOfString(l.value, { width: width(doc) - labelW }), 12);
    ensureSpace(doc, h + 2);
    const y = doc.y;
    doc.font("body").fontSize(9.5).fillColor(SOFT).text(l.label, MARGIN, y, { width: labelW - 8 });
    doc.fillColor(INK).text(l.value, MARGIN + labelW, y, { width: width(doc) - labelW });
    doc.y = Math.max(doc.y, y + h) + 2;
  }
  doc.x = MARGIN;
}

export function paragraph(doc: Doc, text: string, opts: { colour?: string; size?: number } = {}) {
  ensureSpace(doc, 14);
  doc.font("body").fontSize(opts.size ?? 9.5).fillColor(opts.colour ?? INK).text(text, MARGIN, doc.y, { width: width(doc) });
}

/** Axes with ticks and labels inside the box; returns the scales. */
export function axes(doc: Doc, box: { x: number; y: number; w: number; h: number }, xMax: number, yMin: number, yMax: number, xLabel: string, yLabel: string, yFmt: (v: number) => string) {
  const sx = (x: number) => box.x + (x / xMax) * box.w;
  const sy = (y: number) => box.y + box.h - ((Math.min(Math.max(y, yMin), yMax) - yMin) / (yMax - yMin)) * box.h;
  doc.lineWidth(0.4).strokeColor("#e5e7eb");
  for (const t of ticks(yMax - yMin, 4)) {
    const v = yMin + t;
    if (v > yMax) continue;
    doc.moveTo(box.x, sy(v)).lineTo(box.x + box.w, sy(v)).stroke();
    doc.font("body").fontSize(7.5).fillColor(SOFT).text(yFmt(v), box.x - 52, sy(v) - 4, { width: 48, align: "right" });
  }
  for (const t of ticks(xMax, 5).filter((t) => t <= xMax)) {
    doc.moveTo(sx(t), box.y + box.h).lineTo(sx(t), box.y + box.h + 3).lineWidth(0.6).strokeColor(SOFT).stroke();
    doc.font("body").fontSize(7.5).fillColor(SOFT).text(formatNumber(t, 3, RECORD_NUMBERS), sx(t) - 20, box.y + box.h + 5, { width: 40, align: "center" });
  }
  doc.moveTo(box.x, box.y).lineTo(box.x, box.y + box.h).lineTo(box.x + box.w, box.y + box.h).lineWidth(0.8).strokeColor(SOFT).stroke();
  doc.font("body").fontSize(8.5).fillColor(INK).text(xLabel, box.x, box.y + box.h + 17, { width: box.w, align: "center" });
  doc.save().rotate(-90, { origin: [box.x - 58, box.y + box.h / 2] });
  doc.text(yLabel, box.x - 58 - box.h / 2, box.y + box.h / 2 - 5, { width: box.h, align: "center" });
  doc.restore();
  return { sx, sy };
}

export function table(doc: Doc, headings: string[], rows: string[][], widths: number[], numeric: boolean[]) {
  const total = widths.reduce((a, b) => a + b, 0);
  const scale = width(doc) / total;
  const ws = widths.map((w) => w * scale);
  const drawRow = (cells: string[], bold: boolean) => {
    doc.font(bold ? "bold" : "body").fontSize(8.5);
    const h = Math.max(...cells.map((c, i) => doc.heightOfString(c, { width: ws[i] - 6 }))) + 6;
    if (doc.y + h > bottom(doc)) {
      doc.addPage();
      if (!bold) drawRow(headings, true);
      doc.font("body").fontSize(8.5);
    }
    const y = doc.y;
    let x = MARGIN;
    cells.forEach((c, i) => {
      doc.fillColor(bold ? SOFT : INK).text(c, x + 3, y + 3, { width: ws[i] - 6, align: numeric[i] && !bold ? "right" : "left" });
      x += ws[i];
    });
    doc.moveTo(MARGIN, y + h).lineTo(MARGIN + width(doc), y + h).lineWidth(0.4).strokeColor(LINE).stroke();
    doc.y = y + h;
  };
  drawRow(headings, true);
  for (const r of rows) drawRow(r, false);
  doc.x = MARGIN;
  doc.moveDown(0.3);
}


/** The "Stages" heading and table of either kind of train; a short table (8 stages or fewer) is kept on one page with its heading. */
export function stagesTable<S>(doc: Doc, columns: { heading: string; shown: (s: S) => string; numeric: boolean }[], stages: S[], widths: number[]) {
  if (stages.length <= 8) ensureSpace(doc, 80 + stages.length * 26);
  heading(doc, "Stages");
  table(
    doc,
    columns.map((c) => c.heading),
    stages.map((s) => columns.map((c) => c.shown(s))),
    widths,
    columns.map((c) => c.numeric),
  );
}
