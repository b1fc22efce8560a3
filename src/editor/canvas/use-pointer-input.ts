import { useCallback, useRef, type RefObject } from 'react';
import type { Editor } from '../create-editor';
import { panBy, screen, zoomAt } from '../geometry/coords';

/**
 * DOM pointer, wheel and key events on the canvas wrapper, turned into editor calls in screen
 * pixels. Two touching fingers pinch-zoom and pan the camera (and cancel any tool gesture).
 */
export function usePointerInput(editor: Editor, wrap: RefObject<HTMLDivElement | null>) {
  const touches = useRef(new Map<number, { x: number; y: number }>());
  const pinch = useRef<{ dist: number; mid: { x: number; y: number } } | null>(null);

  const local = useCallback(
    (e: { clientX: number; clientY: number }) => {
      const r = wrap.current!.getBoundingClientRect();
      return { x: e.clientX - r.left, y: e.clientY - r.top };
    },
    [wrap],
  );

  const pinchState = () => {
    const [a, b] = [...touches.current.values()];
    return { dist: Math.hypot(a.x - b.x, a.y - b.y), mid: { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 } };
  };

  return {
    onPointerDown(e: React.PointerEvent) {
      wrap.current?.focus();
      const p = local(e);
      if (e.pointerType === 'touch') {
        touches.current.set(e.pointerId, p);
        if (touches.current.size === 2) {
          editor.pointerCancel();
          pinch.current = pinchState();
          return;
        }
        if (touches.current.size > 2) return;
      }
      (e.target as Element).setPointerCapture?.(e.pointerId);
      editor.pointerDown({ ...p, shift: e.shiftKey, alt: e.altKey, ctrl: e.ctrlKey || e.metaKey, button: e.button, touch: e.pointerType === 'touch' });
    },
    onPointerMove(e: React.PointerEvent) {
      const p = local(e);
      if (e.pointerType === 'touch' && touches.current.has(e.pointerId)) {
        touches.current.set(e.pointerId, p);
        if (pinch.current && touches.current.size === 2) {
          const now = pinchState();
          const { store } = editor;
          let cam = store.getState().session.camera;
          cam = panBy(cam, now.mid.x - pinch.current.mid.x, now.mid.y - pinch.current.mid.y);
          cam = zoomAt(cam, screen(now.mid.x, now.mid.y), now.dist / (pinch.current.dist || 1));
          store.setSession({ camera: cam });
          pinch.current = now;
          return;
        }
      }
      editor.pointerMove({ ...p, shift: e.shiftKey, alt: e.altKey, ctrl: e.ctrlKey || e.metaKey, touch: e.pointerType === 'touch' });
    },
    onPointerUp(e: React.PointerEvent) {
      const p = local(e);
      if (e.pointerType === 'touch') {
        touches.current.delete(e.pointerId);
        if (pinch.current) {
          if (touches.current.size === 0) pinch.current = null;
          return;
        }
      }
      editor.pointerUp({ ...p, shift: e.shiftKey, alt: e.altKey, ctrl: e.ctrlKey || e.metaKey, button: e.button, touch: e.pointerType === 'touch' });
    },
    onPointerLeave() {
      editor.pointerLeave();
    },
    onPointerCancel(e: React.PointerEvent) {
      touches.current.delete(e.pointerId);
      pinch.current = null;
      editor.pointerCancel();
    },
    onWheel(e: React.WheelEvent) {
      const p = local(e);
      // Trackpad pinch arrives as a wheel with ctrl; a plain wheel zooms too (there is no page to scroll).
      editor.wheel({ ...p, deltaY: e.deltaMode === 1 ? e.deltaY * 16 : e.deltaY });
    },
    onContextMenu(e: React.MouseEvent) {
      e.preventDefault();
    },
  };
}
