import type { JobSheet } from '../../../shared/api/job-sheet';
import { formatDate } from '../../../shared/dates';
import { bullets, ensureSpace, heading, newDocument, table } from './document';
import { PALETTE } from '../../../shared/palette';
import { drawPlan, type PlanForDrawing, type StripForDrawing } from './plan-drawing';

const mm = (n: number) => `${Math.round(n)} mm`;

/** One cut list row per roll lane: the strips cut from it in order, and what is left. */
function cutListRows(space: JobSheet['spaces'][number]): string[][] {
  const rows: string[][] = [];
  let lastProduct = '';
  for (const roll of space.rolls) {
    for (const lane of roll.lanes) {
      // The product (and its width) once where it changes, not again on every row of its rolls.
      const product = roll.productName === lastProduct ? '' : roll.productName;
      lastProduct = roll.productName;
      rows.push([
        `Roll ${roll.rollNo}${roll.lanes.length > 1 ? ` lane ${lane.lane}` : ''}`,
        [product, roll.lanes.length > 1 && lane.widthMm ? `${mm(lane.widthMm)} lane` : ''].filter(Boolean).join(', '),
        lane.cuts
          .map(
            (c) =>
              `${c.stripLabel}${c.pieceCount > 1 ? ` (${c.piece}/${c.pieceCount})` : ''} ${mm(c.lengthMm)}${c.widthMm !== undefined ? ` × ${mm(c.widthMm)} lengthwise` : ''}${c.fromOffcut ? ` from ${c.fromOffcut}` : ''}`,
          )
          .join(' · ') || '—',
        lane.offcutMm > 0 ? `${mm(lane.offcutMm)}${lane.offcutKeep === false ? ' (fill)' : ' (keep)'}` : '—',
      ]);
    }
  }
  return rows;
}

/**
 * The installer's job sheet as a PDF: per space the plan with strips numbered and the lay direction,
 * the cut list grouped by roll, then the van load and the site checks to tick. It prints only what
 * the job sheet API gives an installer, which carries no prices.
 */
export async function renderJobSheetPdf(sheet: JobSheet, companyName: string): Promise<Buffer> {
  const { doc, done } = newDocument(`Job sheet ${sheet.job.reference}`);
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  const a = sheet.job.propertyAddress;

  doc.font('ui-bold').fontSize(18).fillColor(PALETTE.timber).text('Job sheet', left, doc.y);
  doc
    .font('mono')
    .fontSize(10)
    .fillColor(PALETTE.graphite)
    .text(`${sheet.job.reference} · install ${sheet.job.installDate ? formatDate(sheet.job.installDate) : 'date to be agreed'}`);
  doc.font('ui').fontSize(10).text([a.line1, a.line2, a.town, a.postcode].filter(Boolean).join(', '));
  doc
    .fontSize(9.5)
    .fillColor(PALETTE.graphiteLight)
    .text(`Customer: ${sheet.job.customer.name}${sheet.job.customer.phone ? ` · ${sheet.job.customer.phone}` : ''}`);
  doc.text(`Installer: ${sheet.job.installer?.name ?? 'not assigned yet'} · ${companyName}`);
  if (sheet.job.accessNotes) doc.fillColor(PALETTE.graphite).text(`Access: ${sheet.job.accessNotes}`, { width });
  if (sheet.job.notes) doc.fillColor(PALETTE.graphite).text(`Notes: ${sheet.job.notes}`, { width });

  heading(doc, 'Safety first');
  bullets(doc, sheet.cautions);

  for (const space of sheet.spaces) {
    doc.addPage();
    doc.font('ui-bold').fontSize(15).fillColor(PALETTE.graphite).text(space.name, left, doc.y);
    const facts = [
      space.netAreaM2 !== null ? `${space.netAreaM2.toFixed(1)} m² net` : '',
      !space.thermalText && space.uValueBefore !== null && space.uValueAfter !== null
        ? `U ${space.uValueBefore.toFixed(2)} → ${space.uValueAfter.toFixed(2)} W/m²K`
        : '',
      space.revision ? `plan revision ${space.revision}` : '',
    ].filter(Boolean);
    doc.font('ui').fontSize(9).fillColor(PALETTE.graphiteLight).text(facts.join(' · '));
    // Each U-value named, as on the quote: the installer's sheet says the same as the customer's papers.
    if (space.thermalText) doc.text(space.thermalText, { width });
    if (space.problem) {
      doc.moveDown(0.5).fillColor(PALETTE.brick).fontSize(10).text(space.problem, { width });
      continue;
    }
    if (space.plan) {
      const strips: StripForDrawing[] = space.layers.flatMap((l) =>
        l.strips.map((s) => ({ parts: s.polygons as Array<Array<[number, number]>>, labelAt: s.labelAt as [number, number], label: s.label, role: l.role })),
      );
      const boxY = doc.y + 6;
      const box = { x: left, y: boxY, width, height: 300 };
      doc.rect(box.x, box.y, box.width, box.height).lineWidth(0.5).strokeColor(PALETTE.paperLine).stroke();
      // The arrow shows the first layer's lay direction, as the phone's plan does; no layer, no arrow.
      const arrowLayer = space.layers[0];
      drawPlan(doc, space.plan as PlanForDrawing, box, { strips, arrowDeg: arrowLayer?.layDirectionDeg });
      doc.y = boxY + box.height + 6;
      doc.x = left;
      doc
        .font('ui')
        .fontSize(7.5)
        .fillColor(PALETTE.graphiteLight)
        .text(
          [
            space.layers.some((l) => l.role === 'base') ? 'Straw: base strips between the joists.' : '',
            space.layers.some((l) => l.role === 'cross') ? 'Teal: cross strips, across the joists.' : '',
            'Numbers are the laying order (from the eaves inward, finishing at the hatch). Red hatching: do not cover. Blue: eaves, keep the ventilation gap.',
            arrowLayer ? `Arrow: lay direction of the ${arrowLayer.label.toLowerCase()}.` : '',
          ]
            .filter(Boolean)
            .join(' '),
          left,
          doc.y,
          { width },
        );
    }
    heading(doc, 'Layers');
    table(
      doc,
      [
        { header: 'Layer', width: 60 },
        { header: 'Product', width: width - 60 - 60 - 60 - 90 },
        { header: 'Depth', width: 60, align: 'right', mono: true },
        { header: 'Area', width: 60, align: 'right', mono: true },
        { header: 'Lay direction', width: 90, align: 'right', mono: true },
      ],
      space.layers.map((l) => [
        l.label,
        l.productName,
        mm(l.thicknessMm),
        `${l.areaM2.toFixed(1)} m²`,
        `${Math.round(l.layDirectionDeg)}° (${l.strips.length} strips)`,
      ]),
    );
    heading(doc, 'Cut list, by roll');
    table(
      doc,
      [
        { header: 'Roll', width: 70 },
        { header: 'Product', width: 140 },
        { header: 'Strips in order (label length)', width: width - 70 - 140 - 60, mono: true },
        { header: 'Offcut', width: 60, align: 'right', mono: true },
      ],
      cutListRows(space),
    );
    heading(doc, 'Site checks');
    for (const c of space.checks) {
      ensureSpace(doc, 30);
      const y = doc.y;
      doc
        .rect(left, y + 1, 9, 9)
        .lineWidth(0.8)
        .strokeColor(PALETTE.graphite)
        .stroke();
      doc
        .font('ui-bold')
        .fontSize(9.5)
        .fillColor(PALETTE.graphite)
        .text(c.title, left + 16, y, { width: width - 16 });
      doc
        .font('ui')
        .fontSize(8.5)
        .fillColor(PALETTE.graphiteLight)
        .text(c.detail, left + 16, doc.y, { width: width - 16 });
      doc.moveDown(0.3);
    }
  }

  doc.addPage();
  doc.font('ui-bold').fontSize(15).fillColor(PALETTE.graphite).text('Van load', left, doc.y);
  doc.moveDown(0.3);
  table(
    doc,
    [
      { header: 'Item', width: width - 100 },
      { header: 'Quantity', width: 100, align: 'right', mono: true },
    ],
    [
      ...sheet.vanLoad.rolls.map((r) => [`${r.productName} (${mm(r.thicknessMm)})`, `${r.count} rolls`]),
      ...sheet.vanLoad.extras.map((e) => [e.label, `${e.quantity} ${e.unit}`]),
    ],
  );
  return done(`${companyName} · Job sheet ${sheet.job.reference}`);
}
