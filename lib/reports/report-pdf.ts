/**
 * The design report as an A4 PDF (pdfkit): DejaVu Sans embedded (no base-14 font, so every
 * glyph — ³, →, −, × — prints the same everywhere), the Levenspiel chart drawn as vectors,
 * the tables, page numbers and the cautions boxed once, on page 1.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import PDFDocument from "pdfkit";
import { stageStyle } from "@/lib/charts/stage-styles";
import { chartGeometry, type Point } from "@/lib/charts/levenspiel-geometry";
import type { DesignReport } from "./design-report";
import { networkBody } from "./network-report-pdf";
import { robustnessLines } from "./robustness-lines";
import { axes, ensureSpace, FOOTER, heading, INK, MARGIN, pairs, paragraph, SOFT, stagesTable, table, width, type Doc } from "./pdf-parts";
import { inputLines } from "./input-lines";
import { fmtConversion, fmtKelvin, fmtMoney, fmtVolume, hasRecycle, stageColumns } from "./report-format";
import { stageTypeShort } from "@/lib/stage-types";
import { fromSI, unitLabel } from "@/lib/units/display";
import type { DisplayUnits } from "@/lib/units/display-preference";
import { formatDateTime } from "@/lib/format/dates";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";

const FONT_DIR = path.join(process.cwd(), "node_modules", "dejavu-fonts-ttf", "ttf");
let fonts: { regular: Buffer; bold: Buffer } | null = null;
/** The font files, read once per process (pdfkit parses and subsets them per document). */
function fontFiles() {
  fonts ??= { regular: readFileSync(path.join(FONT_DIR, "DejaVuSans.ttf")), bold: readFileSync(path.join(FONT_DIR, "DejaVuSans-Bold.ttf")) };
  return fonts;
}

/** Renders the report; resolves with the whole file. */
export function renderReportPdf(report: DesignReport, units?: DisplayUnits): Promise<Buffer> {
  const { regular, bold } = fontFiles();
  const doc = new PDFDocument({
    size: "A4",
    margins: { top: MARGIN, bottom: MARGIN + FOOTER, left: MARGIN, right: MARGIN },
    bufferPages: true,
    // A font file as the default keeps pdfkit from ever loading Helvetica.
    font: regular as unknown as string,
    info: { Title: `Design report: ${report.train.label} (${report.project.name})`, Author: "Seriatim", Subject: "Pinned reactor train", CreationDate: new Date(report.generatedAt) },
  });
  doc.registerFont("body", regular);
  doc.registerFont("bold", bold);
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });

  header(doc, report);
  cautionsBox(doc, report, "Before you rely on this design");
  if (report.network) networkBody(doc, report, report.network, units);
  else {
    summary(doc, report, units);
    levenspiel(doc, report);
    stageTable(doc, report, units);
    if ((report.thermal.mode === "adiabatic" || report.references.bestTemperaturePath) && report.stages.length) temperatureProfile(doc, report, units);
  }
  sections(doc, report, units);
  footers(doc, report);
  doc.end();
  return done;
}

function header(doc: Doc, r: DesignReport) {
  doc.font("body").fontSize(9).fillColor(SOFT).text(`Seriatim design report · ${r.project.name}`, MARGIN, MARGIN);
  doc.moveDown(0.3).font("bold").fontSize(20).fillColor(INK).text(r.train.label || "Pinned design");
  doc.moveDown(0.2).font("body").fontSize(10).fillColor(INK);
  const review = r.pin.reviewedBy ? `${r.pin.stateLabel} by ${r.pin.reviewedBy}, ${formatDateTime(r.pin.reviewedAt)}` : r.pin.stateLabel;
  pairs(doc, [
    { label: "Review state", value: review },
    ...(r.pin.reviewComment ? [{ label: "Review comment", value: `“${r.pin.reviewComment}”` }] : []),
    { label: "Pinned by", value: `${r.pin.pinnedBy}, ${formatDateTime(r.pin.pinnedAt)}` },
    { label: "Kinetics", value: `${r.kinetics.label} (${r.kinetics.law})` },
    { label: "Generated", value: formatDateTime(r.generatedAt) },
  ]);
}

function cautionsBox(doc: Doc, r: DesignReport, title: string) {
  const w = width(doc);
  const pad = 8;
  const items = [...r.cautions.warnings.map((t) => `⚠ ${t}`), ...r.cautions.general.map((t) => `• ${t}`)];
  doc.font("body").fontSize(9);
  const textH = items.reduce((h, t) => h + doc.heightOfString(t, { width: w - pad * 2 }) + 2, 0);
  const boxH = textH + pad * 2 + 16;
  ensureSpace(doc, boxH + 10);
  doc.moveDown(0.6);
  const top = doc.y;
  doc.rect(MARGIN, top, w, boxH).lineWidth(1).fillAndStroke("#fff8e6", "#b45309");
  doc.font("bold").fontSize(10).fillColor("#7c2d12").text(title, MARGIN + pad, top + pad, { width: w - pad * 2 });
  doc.moveDown(0.2);
  for (const t of items) {
    doc.font("body").fontSize(9).fillColor(t.startsWith("⚠") ? "#991b1b" : INK).text(t, MARGIN + pad, doc.y, { width: w - pad * 2 });
    doc.y += 2;
  }
  doc.y = top + boxH + 4;
  doc.x = MARGIN;
}

function summary(doc: Doc, r: DesignReport, units?: DisplayUnits) {
  heading(doc, "Train");
  pairs(doc, [
    { label: "Sequence", value: r.train.label },
    { label: "Target conversion", value: fmtConversion(r.target.conversion) },
    { label: "Conversion reached", value: fmtConversion(r.target.conversionReached) },
    { label: "Total volume", value: fmtVolume(r.train.totalVolume, units) },
    ...(r.train.totalCost !== null ? [{ label: "Total vessel cost", value: fmtMoney(r.train.totalCost) }] : []),
    { label: "Volume over single PFR", value: r.train.ratioToPfr === null ? "—" : formatNumber(r.train.ratioToPfr, 4, RECORD_NUMBERS) },
  ]);
}

const HATCH_ANGLES = [45, 90, -45, 0, 30, -30, 60, -60];

function polygonPath(doc: Doc, pts: Point[], sx: (x: number) => number, sy: (y: number) => number) {
  pts.forEach(([x, y], i) => (i ? doc.lineTo(sx(x), sy(y)) : doc.moveTo(sx(x), sy(y))));
  doc.closePath();
}

function levenspiel(doc: Doc, r: DesignReport) {
  heading(doc, "Levenspiel plot");
  const recycleNote = r.chart.stages.some((s) => s.type === "PFR-recycle")
    ? " Each tube with recycle is the rectangle over its span at the mean height over its tube; the area under the curve from the tube's inlet X1 (outlined dashed) times R + 1 is the same volume."
    : "";
  paragraph(doc, `FA0/(−rA) against conversion X. Each CSTR is the rectangle at its outlet height, each PFR the area under the curve over its span; each area is the stage volume.${recycleNote}`, { colour: SOFT, size: 8.5 });
  const geo = chartGeometry({ curve: r.chart.curve, stages: r.chart.stages, target: r.chart.target ?? undefined, equilibrium: r.chart.equilibrium });
  const h = 230;
  ensureSpace(doc, h + 50);
  const box = { x: MARGIN + 64, y: doc.y + 8, w: width(doc) - 76, h };
  const { sx, sy } = axes(doc, box, geo.xMax, 0, geo.yMax, "Conversion X", "FA0/(−rA), m³", (v) => formatNumber(v, 3, RECORD_NUMBERS));
  doc.save();
  doc.rect(box.x, box.y, box.w, box.h).clip();
  for (const s of geo.stages) {
    const style = stageStyle(s.index);
    polygonPath(doc, s.polygon, sx, sy);
    doc.fillColor(style.fill).fill();
    // Hatch inside the outline, one direction per stage, so stages stay apart in grey print.
    doc.save();
    polygonPath(doc, s.polygon, sx, sy);
    doc.clip();
    const angle = HATCH_ANGLES[s.index % HATCH_ANGLES.length];
    doc.rotate(angle, { origin: [box.x + box.w / 2, box.y + box.h / 2] });
    doc.lineWidth(0.5).strokeColor(style.stroke).strokeOpacity(0.7);
    for (let d = -box.w; d <= box.w * 2; d += 6) doc.moveTo(box.x + d - box.w / 2, box.y - box.w).lineTo(box.x + d - box.w / 2, box.y + box.h + box.w).stroke();
    doc.restore();
    polygonPath(doc, s.polygon, sx, sy);
    doc.lineWidth(1).strokeColor(style.stroke).strokeOpacity(1).stroke();
    if (s.underCurve) {
      polygonPath(doc, s.underCurve.polygon, sx, sy);
      doc.fillColor(style.stroke).fillOpacity(0.2).fill().fillOpacity(1);
      polygonPath(doc, s.underCurve.polygon, sx, sy);
      doc.dash(3, { space: 2 }).lineWidth(1).strokeColor(style.stroke).stroke().undash();
    }
  }
  if (geo.curve.length > 1) {
    geo.curve.forEach(([x, y], i) => (i ? doc.lineTo(sx(x), sy(y)) : doc.moveTo(sx(x), sy(y))));
    doc.lineWidth(1.3).strokeColor(INK).stroke();
  }
  const marker = (x: number, colour: string, label: string, dash: number) => {
    doc.moveTo(sx(x), box.y).lineTo(sx(x), box.y + box.h).dash(dash, { space: 3 }).lineWidth(1).strokeColor(colour).stroke().undash();
    doc.font("body").fontSize(7.5).fillColor(colour).text(label, sx(x) - 104, box.y + 3, { width: 100, align: "right" });
  };
  if (r.chart.target !== null) marker(r.chart.target, "#115a54", `target ${fmtConversion(r.chart.target)}`, 5);
  if (r.chart.equilibrium) marker(r.chart.equilibrium, "#9a3412", `equilibrium ${fmtConversion(r.chart.equilibrium)}`, 2);
  doc.restore();
  // Labels: stage number, type and volume, above the middle of each area.
  for (const s of geo.stages) {
    const cx = sx((s.conversionIn + s.conversionOut) / 2);
    const tops = s.polygon.map(([, y]) => y).filter((y) => y > 0);
    const top = Math.max(box.y + 4, sy(Math.max(...tops, 0)) - 24 - (s.index % 2) * 4);
    const name = `${s.index + 1} ${stageTypeShort(s.type)}${s.underCurve ? `, R = ${formatNumber(s.underCurve.recycleRatio, 3, RECORD_NUMBERS)}` : ""}`;
    const label = `${name}\n${fmtVolume(s.volume)}`;
    doc.font("bold").fontSize(7.5);
    const w = Math.max(doc.widthOfString(name), doc.widthOfString(fmtVolume(s.volume))) + 6;
    doc.rect(cx - w / 2, top - 1, w, 21).fillOpacity(0.85).fill("#ffffff").fillOpacity(1);
    doc.fillColor(INK).text(label, cx - w / 2, top, { width: w, align: "center", lineGap: -1 });
  }
  doc.y = box.y + box.h + 32;
  doc.x = MARGIN;
}

function stageTable(doc: Doc, r: DesignReport, units?: DisplayUnits) {
  if (hasRecycle(r.stages)) stagesTable(doc, stageColumns(units, true), r.stages, [30, 56, 40, 36, 36, 42, 42, 50, 62, 60, 40]);
  else stagesTable(doc, stageColumns(units), r.stages, [36, 36, 40, 40, 46, 46, 56, 70, 76, 44]);
}

function temperatureProfile(doc: Doc, r: DesignReport, units?: DisplayUnits) {
  const path = r.references.bestTemperaturePath;
  heading(doc, path ? "Conversion and temperature" : "Temperature profile (adiabatic)");
  const temps = r.stages.flatMap((s) => [s.temperatureIn, s.temperatureOut]).filter(Number.isFinite);
  if (r.thermal.maxTemperature !== null) temps.push(r.thermal.maxTemperature);
  // The path widens the axis; the equilibrium line does not (it climbs far above near zero conversion).
  if (path) temps.push(...path.points.map((p) => p.temperature));
  const lo = Math.floor(Math.min(...temps) - 2);
  const hi = Math.ceil(Math.max(...temps) + 2);
  const h = 150;
  ensureSpace(doc, h + 45);
  const box = { x: MARGIN + 64, y: doc.y + 6, w: width(doc) - 76, h };
  const xMax = Math.min(1, Math.max(...r.stages.map((s) => s.conversionOut)) * 1.05 || 1);
  const { sx, sy } = axes(doc, box, xMax, lo, hi, "Conversion X", `Temperature, ${units ? unitLabel("temperature", units.temperature) : "K"}`, (v) => formatNumber(units ? fromSI("temperature", v, units.temperature) : v, 4, RECORD_NUMBERS));
  if (path) {
    const line = (pts: { x: number; y: number }[], colour: string, dash: boolean) => {
      const inside = pts.filter((p) => p.y >= lo && p.y <= hi && p.x <= xMax);
      if (inside.length < 2) return;
      doc.save();
      doc.moveTo(sx(inside[0]!.x), sy(inside[0]!.y));
      for (const p of inside.slice(1)) doc.lineTo(sx(p.x), sy(p.y));
      if (dash) doc.dash(4, { space: 3 });
      doc.lineWidth(1).strokeColor(colour).stroke().undash();
      doc.restore();
    };
    line(path.points.flatMap((p) => (p.equilibriumTemperature === undefined ? [] : [{ x: p.conversion, y: p.equilibriumTemperature }])), "#b45309", false);
    line(path.points.map((p) => ({ x: p.conversion, y: p.temperature })), INK, true);
    doc.font("body").fontSize(7.5).fillColor(INK).text("- - best temperature path", box.x + box.w - 130, box.y + 2, { width: 128, align: "right" });
    doc.fillColor("#b45309").text("equilibrium line", box.x + box.w - 130, box.y + 12, { width: 128, align: "right" });
  }
  for (const s of r.stages) {
    const style = stageStyle(s.index - 1);
    doc.moveTo(sx(s.conversionIn), sy(s.temperatureIn)).lineTo(sx(s.conversionOut), sy(s.temperatureOut)).lineWidth(1.6).strokeColor(style.stroke).stroke();
    doc.circle(sx(s.conversionOut), sy(s.temperatureOut), 2).fill(style.stroke);
    doc.font("body").fontSize(7.5).fillColor(INK).text(`${s.index} ${s.type} ${fmtKelvin(s.temperatureOut, units)}`, sx(s.conversionOut) - 80, sy(s.temperatureOut) - 11, { width: 78, align: "right" });
  }
  if (r.thermal.maxTemperature !== null) {
    const y = sy(r.thermal.maxTemperature);
    doc.moveTo(box.x, y).lineTo(box.x + box.w, y).dash(3, { space: 3 }).lineWidth(0.8).strokeColor("#991b1b").stroke().undash();
    doc.font("body").fontSize(7.5).fillColor("#991b1b").text(`limit ${fmtKelvin(r.thermal.maxTemperature, units)}`, box.x + 4, y - 10);
  }
  doc.y = box.y + box.h + 32;
  doc.x = MARGIN;
}

function sections(doc: Doc, r: DesignReport, units?: DisplayUnits) {
  // A train of several reactions shows its feed, reactions, limits and references in networkBody.
  if (!r.network) feedAndKinetics(doc, r);
  source(doc, r);
  if (!r.network) targetAndReferences(doc, r, units);
  costsAndAfter(doc, r);
}

function feedAndKinetics(doc: Doc, r: DesignReport) {
  heading(doc, "Feed");
  pairs(doc, r.feed);
  heading(doc, "Kinetics");
  pairs(doc, [
    { label: "Model and version", value: r.kinetics.label },
    { label: "Rate law", value: `${r.kinetics.law}: ${r.kinetics.formula}` },
    ...r.kinetics.parameters,
    ...r.kinetics.reaction,
  ]);
}

function source(doc: Doc, r: DesignReport) {
  heading(doc, "Source of the kinetics");
  if (!r.source.recorded) paragraph(doc, "Not recorded: the kinetics were typed in, not derived from a rate dataset.", { colour: SOFT });
  else {
    pairs(doc, [
      { label: "Dataset", value: `${r.source.dataset}, version ${r.source.datasetVersion} (${r.source.fileName}, ${r.source.rowCount} rows)` },
      { label: "Use", value: r.source.kind === "fit" ? "fitted rate law" : "measured table" },
      ...(r.source.fit ? [{ label: "Fitted law", value: r.source.fit.formula ?? r.source.fit.law ?? "—" }, { label: "R²", value: r.source.fit.rSquared === null ? "—" : r.source.fit.rSquared.toFixed(4) }] : []),
    ]);
    if (r.source.fit?.parameters.length) {
      table(
        doc,
        ["Parameter", "Value", "Standard error", "95 % interval"],
        r.source.fit.parameters.map((p) => [p.name, formatNumber(p.value, 5, RECORD_NUMBERS), p.standardError === null ? "—" : `± ${formatNumber(p.standardError, 3, RECORD_NUMBERS)}`, p.interval95 ? `${formatNumber(p.interval95[0], 4, RECORD_NUMBERS)} to ${formatNumber(p.interval95[1], 4, RECORD_NUMBERS)}` : "—"]),
        [1, 1, 1, 1.4],
        [false, true, true, true],
      );
    }
  }
}

function targetAndReferences(doc: Doc, r: DesignReport, units?: DisplayUnits) {
  heading(doc, "Target and search");
  pairs(doc, [{ label: "Target conversion", value: fmtConversion(r.target.conversion) }, ...r.objective]);
  heading(doc, "Equilibrium and references");
  pairs(doc, [
    { label: "Equilibrium conversion", value: r.equilibriumConversion === null ? "none (irreversible rate)" : fmtConversion(r.equilibriumConversion) },
    { label: "Single CSTR to the target", value: fmtVolume(r.references.singleCSTR, units) },
    { label: "Single PFR to the target", value: fmtVolume(r.references.singlePFR, units) },
    { label: "Feed volumetric flow", value: r.references.feedVolumetricFlow === null ? "—" : `${formatNumber(r.references.feedVolumetricFlow, 4, RECORD_NUMBERS)} m³/s` },
  ]);
}

function costsAndAfter(doc: Doc, r: DesignReport) {
  heading(doc, "Costs");
  const cs = r.costs.settings;
  pairs(doc, [
    { label: "Total vessel cost", value: fmtMoney(r.costs.totalCost, cs.recorded ? cs.currency : null) },
    { label: "Installed cost", value: r.costs.installedCost === null ? "not recorded" : fmtMoney(r.costs.installedCost, cs.recorded ? cs.currency : null) },
  ]);
  if (!cs.recorded) paragraph(doc, "Cost basis: not recorded for this project.", { colour: SOFT });
  else {
    pairs(doc, [{ label: "Currency and basis year", value: `${cs.currency ?? "—"}, ${cs.basisYear ?? "—"}` }, ...cs.other]);
    table(
      doc,
      ["Type", "a", "b", "n", "Source"],
      cs.correlations.map((c) => [c.type, formatNumber(c.a, 4, RECORD_NUMBERS), formatNumber(c.b, 4, RECORD_NUMBERS), formatNumber(c.n, 4, RECORD_NUMBERS), c.source]),
      [0.6, 0.8, 0.8, 0.6, 2.5],
      [false, true, true, true, false],
    );
  }
  if (!r.costs.inventoryPlan.recorded) paragraph(doc, "Reuse of idle vessels: not recorded.", { colour: SOFT });
  else {
    const plan = r.costs.inventoryPlan;
    pairs(doc, [{ label: "With reused vessels", value: `${fmtMoney(plan.totalCost)} (all new: ${fmtMoney(plan.allNewCost)})` }]);
    table(
      doc,
      ["Stage", "Vessel", "Cost"],
      plan.assignments.map((a) => [String(a.stage), a.vesselId ? `reuse ${a.vesselTag ?? a.vesselId}` : "buy new", fmtMoney(a.cost)]),
      [0.6, 2, 1],
      [true, false, true],
    );
  }
  heading(doc, "Robustness");
  if (!r.robustness.recorded) paragraph(doc, "Not recorded: no finished Monte Carlo run for this pinned design.", { colour: SOFT });
  else {
    pairs(doc, robustnessLines(r.robustness, r.network?.product ?? null));
  }
  heading(doc, "Assumptions");
  pairs(doc, [{ label: "Note of the pin", value: r.pin.note || "—" }]);
  for (const a of r.assumptions.model) paragraph(doc, `• ${a}`);
  doc.moveDown(0.4);
  // A model of several reactions may keep a quantity with the unit it was typed in; a bare number is SI.
  paragraph(doc, r.network ? "The inputs as computed (as stored; a number without a unit is in SI units):" : "The inputs as computed (as stored, in SI units):", { colour: SOFT, size: 8.5 });
  pairs(doc, inputLines(r.assumptions.spec));
}

function footers(doc: Doc, r: DesignReport) {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const y = doc.page.height - MARGIN;
    // Writing inside the bottom margin: lift it so pdfkit does not start a new page.
    const saved = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    doc.font("body").fontSize(7.5).fillColor(SOFT);
    doc.text(`${r.project.name} · ${r.train.label} · generated ${formatDateTime(r.generatedAt)}`, MARGIN, y, { width: width(doc) - 80, lineBreak: false });
    doc.text(`Page ${i + 1} of ${range.count}`, MARGIN + width(doc) - 80, y, { width: 80, align: "right", lineBreak: false });
    doc.page.margins.bottom = saved;
  }
}
