import { PALETTE } from '../../../shared/palette';
import { MARGIN, newDocument } from '../../lib/pdf/document';

/** R_IP (h·ft²·°F/Btu) per R_SI (m²K/W); the usual conversion factor. */
export const R_SI_TO_IP = 5.678263;

export type HandoverLayer = {
  productName: string;
  role: 'base' | 'cross';
  thicknessMm: number;
  areaM2: number;
  rolls: number;
  lambdaWmK: number | null;
};

export type HandoverData = {
  companyName: string;
  reference: string;
  customerName: string;
  address: string;
  installerName: string;
  installedOn: string;
  spaces: Array<{
    name: string;
    netAreaM2: number | null;
    uValueBefore: number | null;
    uValueAfter: number | null;
    /** The U-values named (ISO 6946 insulated area and whole ceiling, RdSAP default); null without a takeoff. */
    thermalText?: string | null;
    layers: HandoverLayer[];
    photos: Array<{ stage: 'before' | 'after'; caption: string; jpeg: Buffer }>;
  }>;
  showRValues: boolean;
  signedReceipt: boolean;
};

export const CARE_ADVICE = [
  'Keep the eaves vents clear: the air gap at the edges of the loft stops condensation in the roof.',
  'Do not squash the insulation. Compressed insulation keeps far less heat in; store nothing directly on it.',
  'If you want storage, put walkway boards on raised supports that stand clear of the full depth of insulation.',
  'Cables stay on top of the insulation; keep the covers over recessed lights and the clearance around flues and chimneys.',
  'Wear gloves, goggles and a dust mask if you move the insulation, and tread only on joists or boards.',
];

const INK = PALETTE.graphite;
const MUTED = PALETTE.graphiteLight;

/** R-value (m²K/W) of a layer of this thickness and conductivity; null when the conductivity is unknown. */
export function layerRValueSI(thicknessMm: number, lambdaWmK: number | null): number | null {
  if (!lambdaWmK || lambdaWmK <= 0) return null;
  return thicknessMm / 1000 / lambdaWmK;
}

const fmt = (n: number | null, digits: number, unit = '') => (n === null ? '—' : `${n.toFixed(digits)}${unit}`);

/** Renders the customer's handover pack as a PDF (A4, Inter), returned as one Buffer. */
export function renderHandoverPdf(d: HandoverData): Promise<Buffer> {
  const { doc, done } = newDocument(`Handover pack ${d.reference}`, { author: d.companyName });
  const width = doc.page.width - 2 * MARGIN;

  doc.font('ui-heavy').fontSize(20).fillColor(INK).text('Loft insulation handover pack');
  doc.font('ui').fontSize(10).fillColor(MUTED).text(`${d.companyName} · job ${d.reference}`);
  doc.moveDown(0.6).fillColor(INK).fontSize(11);
  doc.text(`Customer: ${d.customerName}`);
  doc.text(`Property: ${d.address}`);
  doc.text(`Installed by ${d.installerName} on ${d.installedOn}`);

  for (const s of d.spaces) {
    doc.moveDown(1).font('ui-heavy').fontSize(14).fillColor(INK).text(s.name);
    doc.font('ui').fontSize(10.5);
    doc.text(`Area insulated: ${fmt(s.netAreaM2, 1, ' m²')}`);
    doc.text(s.thermalText ?? `U-value before: ${fmt(s.uValueBefore, 2, ' W/m²K')}   after: ${fmt(s.uValueAfter, 2, ' W/m²K')}`);
    for (const l of s.layers) {
      const r = layerRValueSI(l.thicknessMm, l.lambdaWmK);
      const rText = d.showRValues && r !== null ? ` · R ${r.toFixed(2)} m²K/W (R-${(r * R_SI_TO_IP).toFixed(1)} imperial)` : '';
      doc.text(
        `• ${l.role === 'base' ? 'Between the joists' : 'Across the joists'}: ${l.productName}; ${l.thicknessMm} mm thick, ${l.areaM2.toFixed(1)} m², ${l.rolls} roll${l.rolls === 1 ? '' : 's'}${rText}`,
        { width },
      );
    }
    drawPhotos(doc, s.photos, width);
  }

  doc.moveDown(1).font('ui-heavy').fontSize(13).fillColor(INK).text('Looking after your insulation', MARGIN);
  doc.font('ui').fontSize(10.5);
  for (const line of CARE_ADVICE) doc.text(`• ${line}`, { width });
  doc
    .moveDown(0.4)
    .fillColor(MUTED)
    .fontSize(9)
    .text(
      'Local building regulations, electrical rules and licensed practice come first; ask a qualified person before changing wiring, flues or ventilation.',
      { width },
    );

  if (d.signedReceipt) drawReceipt(doc, d, width);
  return done(`${d.companyName} · Handover pack ${d.reference}`);
}

function drawPhotos(doc: PDFKit.PDFDocument, photos: HandoverData['spaces'][number]['photos'], width: number) {
  if (photos.length === 0) return;
  const boxW = (width - 12) / 2;
  const boxH = 150;
  for (let i = 0; i < photos.length; i += 2) {
    if (doc.y + boxH + 30 > doc.page.height - MARGIN) doc.addPage();
    const top = doc.y + 6;
    photos.slice(i, i + 2).forEach((p, j) => {
      const x = MARGIN + j * (boxW + 12);
      doc.image(p.jpeg, x, top, { fit: [boxW, boxH], align: 'center', valign: 'center' });
      doc
        .font('ui')
        .fontSize(8.5)
        .fillColor(MUTED)
        .text(`${p.stage === 'before' ? 'Before' : 'After'}${p.caption ? ` — ${p.caption}` : ''}`, x, top + boxH + 2, { width: boxW });
    });
    doc.x = MARGIN;
    doc.y = top + boxH + 16;
  }
  doc.fillColor(INK);
}

function drawReceipt(doc: PDFKit.PDFDocument, d: HandoverData, width: number) {
  doc.addPage();
  doc.font('ui-heavy').fontSize(14).fillColor(INK).text('Receipt of insulation installed');
  doc.font('ui').fontSize(10.5).moveDown(0.4);
  doc.text(`Job ${d.reference}, ${d.address}, installed on ${d.installedOn} by ${d.installerName}.`, { width });
  doc.moveDown(0.5);
  for (const s of d.spaces) {
    for (const l of s.layers) {
      const r = layerRValueSI(l.thicknessMm, l.lambdaWmK);
      doc.text(
        `${s.name}: ${l.productName} (mineral wool roll) · area ${l.areaM2.toFixed(1)} m² · installed thickness ${l.thicknessMm} mm · R-value ${r === null ? 'not stated' : `${r.toFixed(2)} m²K/W (R-${(r * R_SI_TO_IP).toFixed(1)})`}`,
        { width },
      );
    }
  }
  doc.moveDown(2);
  const y = doc.y;
  doc
    .moveTo(MARGIN, y + 24)
    .lineTo(248, y + 24)
    .strokeColor(INK)
    .stroke();
  doc
    .moveTo(300, y + 24)
    .lineTo(500, y + 24)
    .stroke();
  doc
    .fontSize(9)
    .fillColor(MUTED)
    .text('Installer signature', MARGIN, y + 28)
    .text('Customer signature', 300, y + 28);
  doc.x = MARGIN;
}
