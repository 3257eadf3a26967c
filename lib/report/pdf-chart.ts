import { CHART_INK, levelInk, type ChartGeometry, type Point } from "./chart";

type Doc = PDFKit.PDFDocument;

function polyline(doc: Doc, points: readonly Point[]) {
  doc.moveTo(points[0]!.x, points[0]!.y);
  for (const point of points.slice(1)) doc.lineTo(point.x, point.y);
}

/**
 * Draws a chart's geometry with pdfkit's vector paths, its box's top left corner at (x, y).
 * `font` names the registered font for its labels.
 */
export function drawChart(doc: Doc, chart: ChartGeometry, x: number, y: number, font: string) {
  const { plot } = chart;
  const right = plot.left + plot.width;
  const bottom = plot.top + plot.height;
  doc.save();
  doc.translate(x, y);
  doc.font(font).fontSize(7);

  for (const mark of chart.marks) {
    doc.rect(mark.left, plot.top, mark.right - mark.left, plot.height).fillOpacity(0.14).fill(levelInk(mark.level));
    doc.fillOpacity(1).fillColor(levelInk(mark.level));
    doc.polygon([mark.left - 3, plot.top - 8], [mark.left + 3, plot.top - 8], [mark.left, plot.top - 2]).fill();
    doc.text(String(mark.number), mark.left + 4, plot.top - 14, { lineBreak: false });
  }
  doc.fillOpacity(1);

  for (const tick of chart.yTicks) {
    doc.moveTo(plot.left, tick.y).lineTo(right, tick.y).lineWidth(0.4).strokeColor(CHART_INK.grid).stroke();
    doc.fillColor(CHART_INK.axis).text(tick.label, 0, tick.y - 3.5, { width: plot.left - 4, align: "right", lineBreak: false });
  }
  for (const tick of chart.xTicks) {
    doc.moveTo(tick.x, bottom).lineTo(tick.x, bottom + 3).lineWidth(0.5).strokeColor(CHART_INK.axis).stroke();
    tick.lines.forEach((line, i) => doc.fillColor(CHART_INK.axis).text(line, tick.x - 30, bottom + 5 + i * 8, { width: 60, align: "center", lineBreak: false }));
  }

  for (const band of chart.bands) {
    polyline(doc, band);
    doc.closePath().fillOpacity(0.22).fill(CHART_INK.band);
  }
  doc.fillOpacity(1);
  for (const mean of chart.means) {
    polyline(doc, mean);
    doc.lineWidth(0.8).strokeColor(CHART_INK.mean).stroke();
  }

  for (const line of chart.limits) {
    doc.moveTo(plot.left, line.y).lineTo(right, line.y).lineWidth(1).dash(4, { space: 3 }).strokeColor(levelInk(line.level)).stroke();
    doc.undash();
    doc.fillColor(levelInk(line.level)).text(line.text, plot.left + 3, line.y - 9, { lineBreak: false });
  }
  const placed = { above: 0, below: 0 };
  for (const line of chart.offScale) {
    const slot = placed[line.side]++;
    const top = line.side === "above" ? plot.top + 2 + slot * 9 : bottom - 10 - slot * 9;
    doc.fillColor(levelInk(line.level)).text(`${line.side === "above" ? "↑" : "↓"} ${line.label}`, plot.left, top, { width: plot.width - 3, align: "right", lineBreak: false });
  }

  doc.rect(plot.left, plot.top, plot.width, plot.height).lineWidth(0.6).strokeColor(CHART_INK.axis).stroke();
  // The value axis's name, turned to read upwards along it.
  doc.save();
  doc.rotate(-90, { origin: [8, plot.top + plot.height / 2] });
  doc.fontSize(8).fillColor(CHART_INK.text).text(chart.valueLabel, 8 - plot.height / 2, plot.top + plot.height / 2 - 4, { width: plot.height, align: "center", lineBreak: false });
  doc.restore();
  doc.restore();
}
