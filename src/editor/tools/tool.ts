import type { EditorStore } from '../store/editor-store';
import type { Camera, ScreenPt, WorldPt } from '../geometry/coords';

/** A pointer event as the tools see it: both coordinate spaces and the modifier keys. */
export type ToolPointer = {
  screen: ScreenPt;
  world: WorldPt;
  shift: boolean;
  /** Alt held: draw freely, no grid or angle snapping. */
  alt: boolean;
  ctrl: boolean;
  button: number;
  /** A finger rather than a mouse or pen: hit targets grow. */
  touch?: boolean;
};

export type ToolKey = { key: string; shift: boolean; ctrl: boolean; alt: boolean };

export type ToolContext = { store: EditorStore; camera: () => Camera };

/**
 * A tool is a small state machine (idle → pointing → dragging) turning pointer and key events
 * into commands. It never touches Konva; its `state` is exposed for tests and the cursor.
 */
export interface Tool {
  readonly id: string;
  state(): string;
  pointerDown(ctx: ToolContext, e: ToolPointer): void;
  pointerMove(ctx: ToolContext, e: ToolPointer): void;
  pointerUp(ctx: ToolContext, e: ToolPointer): void;
  /** Returns true if the key was handled. */
  keyDown(ctx: ToolContext, k: ToolKey): boolean;
  cancel(ctx: ToolContext): void;
}

/** Pixels a pointer must travel before a press becomes a drag. */
export const DRAG_THRESHOLD_PX = 4;
/** Hit tolerance in screen pixels for a mouse or pen; fingers get twice as much. */
export const HIT_PX = 10;

export function hitPx(e: { touch?: boolean }): number {
  return e.touch ? HIT_PX * 2 : HIT_PX;
}
/** Grid the pointer snaps to by default, mm. */
export const SNAP_GRID_MM = 100;
/** Edges shorter than this on screen get no "insert corner" midpoint handle. */
export const MIN_EDGE_PX_FOR_MIDPOINT = 30;
