import { useSyncExternalStore } from 'react';
import { formatLength } from '../geometry/units';
import type { Units } from '../store/session';
import { useEditor, useEditorSelect } from './editor-context';

const MM_PER_FT = 304.8;

/**
 * The longest round length whose bar is at most `maxPx` on screen at `zoom` (px per mm): 1, 2 or
 * 5 × a power of ten in mm, or whole feet (1, 2, 5, 10, 20 … ft) in imperial.
 */
export function scaleBarLength(zoom: number, units: Units, maxPx = 140): { mm: number; px: number; label: string } {
  const maxMm = maxPx / zoom;
  if (units === 'imperial') {
    const ft = niceBelow(maxMm / MM_PER_FT);
    const mm = ft * MM_PER_FT;
    return { mm, px: mm * zoom, label: `${ft} ft` };
  }
  const mm = niceBelow(maxMm);
  return { mm, px: mm * zoom, label: mm >= 1000 ? `${mm / 1000} m` : `${mm} mm` };
}

function niceBelow(v: number): number {
  const p = 10 ** Math.floor(Math.log10(v));
  for (const m of [5, 2, 1]) if (m * p <= v) return m * p;
  return p;
}

/** A bar of a round length at the current zoom, in the display units. */
export function ScaleBar() {
  const zoom = useEditorSelect((s) => s.session.camera.zoom);
  const units = useEditorSelect((s) => s.session.units);
  const bar = scaleBarLength(zoom, units);
  return (
    <div className="rounded bg-paper/90 px-1.5 py-1 font-mono text-[11px] text-graphite shadow-sm" data-testid="scale-bar" data-mm={bar.mm}>
      <div className="h-1.5 border-x-2 border-b-2 border-graphite" style={{ width: `${Math.round(bar.px)}px` }} />
      <div className="text-center">{bar.label}</div>
    </div>
  );
}

/** Where the pointer is on the plan, in the display units (blank off the canvas). */
export function CursorReadout() {
  const editor = useEditor();
  const units = useEditorSelect((s) => s.session.units);
  const c = useSyncExternalStore(editor.subscribeCursor, editor.cursor, editor.cursor);
  const unit = units === 'metric' ? ' mm' : '';
  return (
    <div className="min-w-44 rounded bg-paper/90 px-1.5 py-1 font-mono text-[11px] text-graphite shadow-sm" data-testid="cursor-readout">
      {c ? `x ${formatLength(c[0], units)}${unit}  y ${formatLength(c[1], units)}${unit}` : 'x –  y –'}
    </div>
  );
}
