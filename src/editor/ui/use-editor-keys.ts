import { useEffect } from 'react';
import type { Editor } from '../create-editor';

const isTyping = (t: EventTarget | null) => t instanceof HTMLElement && (t.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(t.tagName));

// Arrows belong to whatever has focus (a radio group, a scrolled panel): they move the plan only
// from the canvas itself or when nothing in particular has focus.
const ownsArrows = (t: EventTarget | null) => t === document.body || (t instanceof HTMLElement && t.closest('[role="application"]') !== null);

/** The editor's shortcuts wherever focus is on the page, except while typing in a field. */
export function useEditorKeys(editor: Editor) {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (isTyping(e.target) || e.defaultPrevented) return;
      if (e.key.startsWith('Arrow') && !ownsArrows(e.target)) return;
      if (editor.keyDown({ key: e.key, shift: e.shiftKey, ctrl: e.ctrlKey || e.metaKey, alt: e.altKey })) e.preventDefault();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [editor]);
}
