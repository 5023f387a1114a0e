/**
 * The PDF pages of a train of several reactions: the train and its measures, the reactions with
 * their rate laws, the feed, objective and limits, the stage and composition tables, the notes on
 * limits and steady states, and the concentration path (each stage's segment over the single tube
 * and the single stirred tanks from the feed), drawn as vectors like the Levenspiel plot.
 */
import { stageStyle } from "@/lib/charts/stage-styles";
import { formatNumber, RECORD_NUMBERS } from "@/lib/format/numbers";
import type { DisplayUnits } from "@/lib/units/display-preference";
import type { DesignReport } from "./design-report";
import type { NetworkReport, PathChart } from "./network-report";
import { chemistryLines, compositionHeadings, fmtConcentration, measureLines, networkStageColumns, referenceLines } from "./network-format";
import { axes, ensureSpace, heading, INK, MARGIN, pairs, paragraph, SOFT, stagesTable, table, width, type Doc } from "./pdf-parts";

export function networkBody(doc: Doc, r: DesignReport, n: NetworkReport, units?: DisplayUnits) {
  heading(doc, "Train");
  pairs(doc, [{ label: "Sequence", value: r.train.label }, { label: "Ranked by", value: n.measures.objectiveLabel }, ...measureLines(n, units)]);
  for (const note of [...n.limitNotes, ...n.steadyStateNotes]) paragraph(doc, note, { colour: "#7c2d12" });

  stagesTable(doc, networkStageColumns(units), n.stages, [36, 40, 60, 80, 60, 50]);

  ensureSpace(doc, 80 + n.composition.rows.length * 22);
  heading(doc, "Outlet composition");
  const headings = compositionHeadings(n);
  table(
    doc,
    headings,
    n.composition.rows.map((row) => [row.label, ...row.values.map(fmtConcentration)]),
    [2.2, ...n.composition.species.map(() => 1)],
    headings.map((_, i) => i > 0),
  );

  // Keep the heading with its chart.
  ensureSpace(doc, n.chart ? 340 : 60);
  heading(doc, "Concentration path");
  if (n.chart) pathChart(doc, n.chart);
  else paragraph(doc, n.chartNote ?? "Not drawn.", { colour: SOFT });

  heading(doc, "Reactions");
  pairs(doc, chemistryLines(n));
  for (const rx of n.reactions) {
    ensureSpace(doc, 40);
    doc.moveDown(0.3).font("bold").fontSize(9.5).fillColor(INK).text(`Reaction ${rx.index}: ${rx.equation}`, MARGIN, doc.y);
    doc.moveDown(0.1);
    pairs(doc, [{ label: "Rate law", value: `${rx.law}: ${rx.formula}` }, ...rx.constants]);
  }

  heading(doc, "Feed");
  pairs(doc, n.feed);
  heading(doc, "Objective and limits");
  pairs(doc, n.objective);
  if (n.references.length) {
    heading(doc, "Single-stage references");
    pairs(doc, referenceLines(n, units));
  }
}

function pathChart(doc: Doc, c: PathChart) {
  paragraph(doc, `C_${c.product} against C_${c.key}, mol/m³. Each stage's segment of the train, over the single tube (dashed) and single stirred tanks of every size (dots) from the same feed.`, { colour: SOFT, size: 8.5 });
  const all = [...c.tube, ...c.tanks, ...c.stages.flatMap((s) => s.points)].filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y));
  const xMax = Math.max(...all.map((p) => p.x), 1e-12) * 1.02;
  const yMax = Math.max(...all.map((p) => p.y), 1e-12) * 1.08;
  const h = 220;
  ensureSpace(doc, h + 70);
  const box = { x: MARGIN + 64, y: doc.y + 8, w: width(doc) - 76, h };
  const fmt = (v: number) => formatNumber(v, 3, RECORD_NUMBERS);
  const { sx, sy } = axes(doc, box, xMax, 0, yMax, `C_${c.key}, mol/m³`, `C_${c.product}, mol/m³`, fmt);
  const line = (pts: { x: number; y: number }[]) => pts.filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y)).forEach((p, i) => (i ? doc.lineTo(sx(p.x), sy(p.y)) : doc.moveTo(sx(p.x), sy(p.y))));
  doc.save();
  doc.rect(box.x, box.y, box.w, box.h).clip();
  for (const p of c.tanks) if (Number.isFinite(p.x) && Number.isFinite(p.y)) doc.circle(sx(p.x), sy(p.y), 1.1).fill("#8a94a3");
  if (c.tube.length > 1) {
    line(c.tube);
    doc.dash(4, { space: 3 }).lineWidth(1.2).strokeColor(INK).stroke().undash();
  }
  for (const s of c.stages) {
    if (s.points.length < 2) continue;
    const style = stageStyle(s.index);
    line(s.points);
    doc.lineWidth(2.2).strokeColor(style.stroke).stroke();
    const end = s.points[s.points.length - 1];
    if (Number.isFinite(end.x) && Number.isFinite(end.y)) doc.circle(sx(end.x), sy(end.y), 2.4).fill(style.stroke);
  }
  doc.restore();
  doc.y = box.y + box.h + 32;
  doc.x = MARGIN;
  // Legend: one entry per stage, then the references.
  const entries = [...c.stages.map((s) => ({ text: `Stage ${s.index + 1} ${s.type}`, colour: stageStyle(s.index).stroke })), { text: "Single tube", colour: INK }, { text: "Single stirred tanks", colour: "#8a94a3" }];
  let x = MARGIN;
  const y = doc.y;
  doc.font("body").fontSize(8);
  for (const e of entries) {
    const w = doc.widthOfString(e.text) + 22;
    if (x + w > MARGIN + width(doc)) break;
    doc.rect(x, y + 3, 12, 3).fill(e.colour);
    doc.fillColor(INK).text(e.text, x + 15, y, { lineBreak: false });
    x += w;
  }
  doc.y = y + 14;
  doc.x = MARGIN;
}
