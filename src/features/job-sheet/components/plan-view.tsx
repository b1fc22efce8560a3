import { useEffect, useMemo, useRef, useState, type PointerEvent as ReactPointerEvent, type WheelEvent } from 'react';
import type { SheetSpace } from '../../../../shared/api/job-sheet';
import { placeStripLabels } from './strip-labels';

type Pt = [number, number];
type View = { x: number; y: number; w: number; h: number };

const pointsAttr = (pts: Pt[]) => pts.map((p) => `${p[0]},${p[1]}`).join(' ');

function bboxOf(pts: Pt[]): View {
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const x = Math.min(...xs);
  const y = Math.min(...ys);
  return { x, y, w: Math.max(...xs) - x || 1, h: Math.max(...ys) - y || 1 };
}

/** Joist centre lines across the plan's box: direction angleDeg, spaced centresMm, first at offsetMm (plan file, joists). */
function joistLines(box: View, j: { angleDeg: number; centresMm: number; offsetMm: number }): [Pt, Pt][] {
  const a = (j.angleDeg * Math.PI) / 180;
  const d: Pt = [Math.cos(a), Math.sin(a)];
  const n: Pt = [-Math.sin(a), Math.cos(a)];
  const corners: Pt[] = [
    [box.x, box.y],
    [box.x + box.w, box.y],
    [box.x, box.y + box.h],
    [box.x + box.w, box.y + box.h],
  ];
  const proj = corners.map((c) => c[0] * n[0] + c[1] * n[1]);
  const first = Math.ceil((Math.min(...proj) - j.offsetMm) / j.centresMm);
  const last = Math.floor((Math.max(...proj) - j.offsetMm) / j.centresMm);
  const reach = box.w + box.h;
  const lines: [Pt, Pt][] = [];
  for (let i = first; i <= last && lines.length < 400; i++) {
    const off = j.offsetMm + i * j.centresMm;
    const base: Pt = [n[0] * off, n[1] * off];
    const along = corners.map((c) => c[0] * d[0] + c[1] * d[1]);
    const mid = (Math.min(...along) + Math.max(...along)) / 2;
    lines.push([
      [base[0] + d[0] * (mid - reach), base[1] + d[1] * (mid - reach)],
      [base[0] + d[0] * (mid + reach), base[1] + d[1] * (mid + reach)],
    ]);
  }
  return lines;
}

/**
 * A space's plan, read-only: outline, eaves band, joists, exclusions, the chosen layer's numbered
 * strips (laid ones darker) and its lay direction. Drag to pan, pinch or wheel to zoom.
 */
export default function PlanView({ space, layerKey, laid }: { space: SheetSpace; layerKey: string | null; laid: Set<string> }) {
  const plan = space.plan!;
  const home = useMemo(() => {
    const b = bboxOf(plan.outline as Pt[]);
    const pad = Math.max(b.w, b.h) * 0.06;
    return { x: b.x - pad, y: b.y - pad, w: b.w + 2 * pad, h: b.h + 2 * pad };
  }, [plan]);
  const [view, setView] = useState<View>(home);
  const svgRef = useRef<SVGSVGElement>(null);
  const pointers = useRef(new Map<number, Pt>());
  const layer = space.layers.find((l) => l.key === layerKey) ?? null;
  const size = Math.max(home.w, home.h);
  const clipId = `outline-${space.id}`;
  const hatchId = `hatch-${space.id}`;

  function toPlan(clientX: number, clientY: number, v: View): Pt {
    const r = svgRef.current!.getBoundingClientRect();
    const s = Math.max(v.w / r.width, v.h / r.height);
    const ox = v.x + (v.w - r.width * s) / 2;
    const oy = v.y + (v.h - r.height * s) / 2;
    return [ox + (clientX - r.left) * s, oy + (clientY - r.top) * s];
  }

  function zoomAt(factor: number, at: Pt) {
    setView((v) => {
      const w = Math.min(Math.max(v.w / factor, home.w / 12), home.w * 3);
      const k = w / v.w;
      return { x: at[0] - (at[0] - v.x) * k, y: at[1] - (at[1] - v.y) * k, w, h: v.h * k };
    });
  }

  function onPointerDown(e: ReactPointerEvent<SVGSVGElement>) {
    e.currentTarget.setPointerCapture(e.pointerId);
    pointers.current.set(e.pointerId, [e.clientX, e.clientY]);
  }

  function onPointerMove(e: ReactPointerEvent<SVGSVGElement>) {
    const prev = pointers.current.get(e.pointerId);
    if (!prev) return;
    const others = [...pointers.current.entries()].filter(([id]) => id !== e.pointerId).map(([, p]) => p);
    pointers.current.set(e.pointerId, [e.clientX, e.clientY]);
    if (others.length === 0) {
      const r = svgRef.current!.getBoundingClientRect();
      setView((v) => {
        const s = Math.max(v.w / r.width, v.h / r.height);
        return { ...v, x: v.x - (e.clientX - prev[0]) * s, y: v.y - (e.clientY - prev[1]) * s };
      });
    } else if (others.length === 1) {
      const o = others[0];
      const before = Math.hypot(prev[0] - o[0], prev[1] - o[1]);
      const after = Math.hypot(e.clientX - o[0], e.clientY - o[1]);
      if (before > 0 && after > 0) zoomAt(after / before, toPlan((e.clientX + o[0]) / 2, (e.clientY + o[1]) / 2, view));
    }
  }

  function onPointerUp(e: ReactPointerEvent<SVGSVGElement>) {
    pointers.current.delete(e.pointerId);
  }

  function onWheel(e: WheelEvent<SVGSVGElement>) {
    zoomAt(e.deltaY < 0 ? 1.2 : 1 / 1.2, toPlan(e.clientX, e.clientY, view));
  }

  // The drawing's size on screen, so strip numbers can be sized and thinned out for the current zoom.
  const [screen, setScreen] = useState({ w: 360, h: 240 });
  useEffect(() => {
    const el = svgRef.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const measure = () => {
      const r = el.getBoundingClientRect();
      if (r.width > 0 && r.height > 0) setScreen((old) => (old.w === r.width && old.h === r.height ? old : { w: r.width, h: r.height }));
    };
    measure();
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  const mmPerPx = Math.max(view.w / screen.w, view.h / screen.h);
  const labels = useMemo(
    () => (layer ? placeStripLabels(layer.strips as Parameters<typeof placeStripLabels>[0], mmPerPx) : { placed: [], hidden: 0 }),
    [layer, mmPerPx],
  );

  return (
    <div className="relative">
      <svg
        ref={svgRef}
        role="img"
        aria-label={`Plan of ${space.name}${layer ? `, ${layer.label} strips` : ''}`}
        viewBox={`${view.x} ${view.y} ${view.w} ${view.h}`}
        className="max-h-[60vh] min-h-48 w-full touch-none select-none rounded-md border-2 border-graphite/30 bg-[#fffdf7]"
        style={{ aspectRatio: `${home.w} / ${home.h}` }}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={onPointerUp}
        onPointerCancel={onPointerUp}
        onWheel={onWheel}
      >
        <defs>
          <clipPath id={clipId}>
            <polygon points={pointsAttr(plan.outline as Pt[])} />
          </clipPath>
          <pattern id={hatchId} width={size / 60} height={size / 60} patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <line x1="0" y1="0" x2="0" y2={size / 60} stroke="#b0462f" strokeWidth={size / 300} />
          </pattern>
        </defs>
        <g clipPath={`url(#${clipId})`}>
          {plan.eavesEdges.map((i) => {
            const a = plan.outline[i] as Pt;
            const b = plan.outline[(i + 1) % plan.outline.length] as Pt;
            return <line key={`eaves-${i}`} x1={a[0]} y1={a[1]} x2={b[0]} y2={b[1]} stroke="#a9d4ef" strokeWidth={Math.max(plan.eavesGapMm, 20) * 2} />;
          })}
          {layer?.strips.map((s) => {
            const isLaid = laid.has(s.id);
            const fill = layer.role === 'base' ? (isLaid ? '#a57e16' : '#f3dc93') : isLaid ? '#135e5a' : '#9fd6d1';
            return s.polygons.map((poly, i) => (
              <polygon key={`${s.id}-${i}`} points={pointsAttr(poly as Pt[])} fill={fill} stroke="#33363b" strokeWidth={size / 900} />
            ));
          })}
          {joistLines(home, plan.joists).map(([a, b], i) => (
            <line
              key={`j-${i}`}
              x1={a[0]}
              y1={a[1]}
              x2={b[0]}
              y2={b[1]}
              stroke="#8a5a2b"
              strokeOpacity={0.55}
              strokeWidth={Math.max(plan.joists.widthMm / 3, size / 1200)}
            />
          ))}
          {plan.exclusions.map((x, i) =>
            x.polygon ? (
              <polygon key={`x-${i}`} points={pointsAttr(x.polygon as Pt[])} fill={`url(#${hatchId})`} stroke="#b0462f" strokeWidth={size / 400} />
            ) : x.at ? (
              <circle
                key={`x-${i}`}
                cx={x.at[0]}
                cy={x.at[1]}
                r={Math.max(size / 80, 60)}
                fill={`url(#${hatchId})`}
                stroke="#b0462f"
                strokeWidth={size / 400}
              />
            ) : null,
          )}
        </g>
        <polygon points={pointsAttr(plan.outline as Pt[])} fill="none" stroke="#33363b" strokeWidth={size / 250} strokeLinejoin="round" />
        {labels.placed.map((l) => {
          const isLaid = laid.has(l.id);
          return (
            <text
              key={`n-${l.id}`}
              x={l.x}
              y={l.y}
              transform={l.rotateDeg ? `rotate(${l.rotateDeg} ${l.x} ${l.y})` : undefined}
              fontSize={l.fontSize}
              textAnchor="middle"
              dominantBaseline="central"
              fontFamily="JetBrains Mono, monospace"
              fontWeight={700}
              fill={isLaid ? '#ffffff' : '#1d1f22'}
              stroke={isLaid ? '#1d1f22' : '#ffffff'}
              strokeWidth={l.fontSize * 0.16}
              paintOrder="stroke"
              data-testid="strip-label"
            >
              {l.label}
            </text>
          );
        })}
      </svg>
      {labels.hidden > 0 && (
        <p className="mt-1 text-sm text-graphite-light" data-testid="labels-hidden">
          {labels.placed.length} of {labels.placed.length + labels.hidden} strip numbers shown: zoom in to read the rest; the cut list has every strip.
        </p>
      )}
      <div className="mt-2 flex items-center gap-2">
        {layer && (
          <span className="mr-auto flex items-center gap-2 whitespace-nowrap text-base font-semibold" data-testid="lay-direction">
            <svg viewBox="0 0 40 40" width="36" height="36" aria-hidden style={{ transform: `rotate(${layer.layDirectionDeg}deg)` }}>
              <path d="M4 20h28M24 11l10 9-10 9" fill="none" stroke="currentColor" strokeWidth="4" strokeLinecap="round" strokeLinejoin="round" />
            </svg>
            Lay direction
          </span>
        )}
        {[
          ['+', 'Zoom in', () => zoomAt(1.5, [view.x + view.w / 2, view.y + view.h / 2])],
          ['−', 'Zoom out', () => zoomAt(1 / 1.5, [view.x + view.w / 2, view.y + view.h / 2])],
          ['Fit', 'Fit the plan', () => setView(home)],
        ].map(([label, title, fn]) => (
          <button
            key={title as string}
            type="button"
            aria-label={title as string}
            onClick={fn as () => void}
            className="h-11 min-w-11 rounded-md border-2 border-graphite/40 bg-white px-2 text-xl font-bold text-graphite shadow"
          >
            {label as string}
          </button>
        ))}
      </div>
    </div>
  );
}
