import type PDFKit from 'pdfkit';
import { PALETTE } from '../../../shared/palette';

type Pt = [number, number];

/** The parts of a plan a drawing needs (a `quiltline-plan/1` plan has all of them). */
export interface PlanForDrawing {
  outline: Pt[];
  eavesEdges?: number[];
  joists?: { angleDeg: number; centresMm: number; offsetMm?: number };
  exclusions?: Array<{ kind: string; polygon?: Pt[]; at?: Pt }>;
}

/** A strip to draw on a job sheet: its parts' outlines in plan mm, its number, where to print it, its layer role. */
export interface StripForDrawing {
  parts: Pt[][];
  label: string;
  labelAt?: Pt;
  role: 'base' | 'cross';
}

export interface PlanBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Plan mm → page points, fitting the outline's bounding box into the box with equal scale on both axes. */
export function fitTransform(outline: Pt[], box: PlanBox, paddingPt = 6) {
  const xs = outline.map((p) => p[0]);
  const ys = outline.map((p) => p[1]);
  const minX = Math.min(...xs),
    maxX = Math.max(...xs),
    minY = Math.min(...ys),
    maxY = Math.max(...ys);
  const w = Math.max(maxX - minX, 1),
    h = Math.max(maxY - minY, 1);
  const scale = Math.min((box.width - 2 * paddingPt) / w, (box.height - 2 * paddingPt) / h);
  const ox = box.x + (box.width - w * scale) / 2;
  const oy = box.y + (box.height - h * scale) / 2;
  return { scale, map: (p: Pt): Pt => [ox + (p[0] - minX) * scale, oy + (p[1] - minY) * scale], bbox: { minX, maxX, minY, maxY } };
}

function pathOf(doc: PDFKit.PDFDocument, pts: Pt[]) {
  pts.forEach((p, i) => (i === 0 ? doc.moveTo(p[0], p[1]) : doc.lineTo(p[0], p[1])));
  doc.closePath();
}

/**
 * Draws a plan with pdfkit vector paths: joists as thin timber lines clipped to the outline,
 * strips (job sheet) in straw/teal with their numbers, exclusions hatched brick red, eaves edges
 * in pale sky blue, the outline in graphite, and an arrow for the base layer's lay direction.
 */
export function drawPlan(
  doc: PDFKit.PDFDocument,
  plan: PlanForDrawing,
  box: PlanBox,
  opts: { strips?: StripForDrawing[]; /** Lay direction to show as an arrow, degrees in plan space (y down), as the phone shows it. */ arrowDeg?: number } = {},
) {
  if (!Array.isArray(plan.outline) || plan.outline.length < 3) return;
  const { map, scale, bbox } = fitTransform(plan.outline, box);
  const outline = plan.outline.map(map);

  doc.save();
  pathOf(doc, outline);
  doc.fillColor(PALETTE.paper).fill();
  doc.restore();

  // Joists and strips, clipped to the outline.
  doc.save();
  pathOf(doc, outline);
  doc.clip();
  for (const s of opts.strips ?? []) {
    for (const part of s.parts) {
      if (part.length < 3) continue;
      pathOf(doc, part.map(map));
      doc
        .fillOpacity(s.role === 'base' ? 0.55 : 0.35)
        .lineWidth(0.3)
        .fillAndStroke(s.role === 'base' ? PALETTE.straw : PALETTE.teal, PALETTE.graphiteLight);
    }
  }
  doc.fillOpacity(1);
  const j = plan.joists;
  if (j && j.centresMm > 0 && j.centresMm * scale >= 1.2) {
    const a = (j.angleDeg * Math.PI) / 180;
    const d: Pt = [Math.cos(a), Math.sin(a)];
    const n: Pt = [-Math.sin(a), Math.cos(a)];
    const corners: Pt[] = [
      [bbox.minX, bbox.minY],
      [bbox.maxX, bbox.minY],
      [bbox.maxX, bbox.maxY],
      [bbox.minX, bbox.maxY],
    ];
    const pn = corners.map((c) => c[0] * n[0] + c[1] * n[1]);
    const pd = corners.map((c) => c[0] * d[0] + c[1] * d[1]);
    const off = j.offsetMm ?? 0;
    const kMin = Math.ceil((Math.min(...pn) - off) / j.centresMm);
    const kMax = Math.floor((Math.max(...pn) - off) / j.centresMm);
    const t0 = Math.min(...pd),
      t1 = Math.max(...pd);
    doc.lineWidth(0.4).strokeColor(PALETTE.timber);
    for (let k = kMin; k <= kMax && k - kMin < 2000; k += 1) {
      const c = off + k * j.centresMm;
      const p0 = map([n[0] * c + d[0] * t0, n[1] * c + d[1] * t0]);
      const p1 = map([n[0] * c + d[0] * t1, n[1] * c + d[1] * t1]);
      doc.moveTo(p0[0], p0[1]).lineTo(p1[0], p1[1]).stroke();
    }
  }
  doc.restore();

  // Strip numbers on top of the joists, sized to their strip (6.5–10 pt); a strip too narrow on
  // the page for a readable number goes without (the cut list names every strip).
  if (opts.strips?.length) {
    doc.font('ui-bold').fillColor(PALETTE.graphite);
    for (const s of opts.strips) {
      const first = s.parts[0] ?? [];
      if (!s.labelAt && first.length === 0) continue;
      const pts = first.map(map);
      const narrowPt = pts.length
        ? Math.min(Math.max(...pts.map((p) => p[0])) - Math.min(...pts.map((p) => p[0])), Math.max(...pts.map((p) => p[1])) - Math.min(...pts.map((p) => p[1])))
        : 0;
      const sizePt = Math.min(10, narrowPt * 0.7);
      if (sizePt < 6.5) continue;
      const [cx, cy] = s.labelAt
        ? map(s.labelAt)
        : map([first.reduce((a, p) => a + p[0], 0) / first.length, first.reduce((a, p) => a + p[1], 0) / first.length]);
      doc.fontSize(sizePt).text(s.label, cx - 20, cy - sizePt / 2, { width: 40, align: 'center', lineBreak: false });
    }
    doc.font('ui');
  }

  // Exclusions: brick red, hatched, clipped to the outline (a chimney breast drawn across the wall
  // must not spill into the page margin; only the part inside the loft matters to the takeoff).
  doc.save();
  pathOf(doc, outline);
  doc.clip();
  for (const e of plan.exclusions ?? []) {
    if (e.polygon && e.polygon.length >= 3) {
      const pts = e.polygon.map(map);
      doc.save();
      pathOf(doc, pts);
      doc.fillOpacity(0.15).fill(PALETTE.brick);
      doc.restore();
      doc.save();
      pathOf(doc, pts);
      doc.clip();
      const xs = pts.map((p) => p[0]),
        ys = pts.map((p) => p[1]);
      const x0 = Math.min(...xs),
        x1 = Math.max(...xs),
        y0 = Math.min(...ys),
        y1 = Math.max(...ys);
      doc.lineWidth(0.5).strokeColor(PALETTE.brick);
      for (let s = x0 - (y1 - y0); s < x1; s += 4)
        doc
          .moveTo(s, y1)
          .lineTo(s + (y1 - y0), y0)
          .stroke();
      doc.restore();
      pathOf(doc, pts);
      doc.lineWidth(0.8).strokeColor(PALETTE.brick).stroke();
    } else if (e.at) {
      const [x, y] = map(e.at);
      doc.circle(x, y, 2.5).lineWidth(0.8).fillAndStroke('#ffffff', PALETTE.brick);
    }
  }
  doc.restore();

  // Eaves edges.
  doc.lineWidth(3).strokeColor(PALETTE.sky);
  for (const i of plan.eavesEdges ?? []) {
    const a = outline[i],
      b = outline[(i + 1) % outline.length];
    if (a && b) doc.moveTo(a[0], a[1]).lineTo(b[0], b[1]).stroke();
  }

  pathOf(doc, outline);
  doc.lineWidth(1.2).strokeColor(PALETTE.graphite).stroke();

  if (opts.arrowDeg !== undefined) {
    const a = (opts.arrowDeg * Math.PI) / 180;
    const cx = box.x + box.width - 22,
      cy = box.y + 16,
      r = 12;
    const dx = Math.cos(a) * r,
      dy = Math.sin(a) * r;
    doc
      .lineWidth(1)
      .strokeColor(PALETTE.graphite)
      .moveTo(cx - dx, cy - dy)
      .lineTo(cx + dx, cy + dy)
      .stroke();
    const ha = Math.atan2(dy, dx);
    doc
      .moveTo(cx + dx, cy + dy)
      .lineTo(cx + dx - 4 * Math.cos(ha - 0.5), cy + dy - 4 * Math.sin(ha - 0.5))
      .lineTo(cx + dx - 4 * Math.cos(ha + 0.5), cy + dy - 4 * Math.sin(ha + 0.5))
      .closePath()
      .fill(PALETTE.graphite);
  }
  doc.lineWidth(1).strokeColor(PALETTE.graphite).fillColor(PALETTE.graphite).fillOpacity(1);
}
