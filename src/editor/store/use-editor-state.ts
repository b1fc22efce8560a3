import { useSyncExternalStore } from 'react';
import type { EditorState, EditorStore } from './editor-store';

/** Subscribes a component to a slice of the editor state; re-renders only when the slice changes. */
export function useEditorState<T>(store: EditorStore, select: (s: EditorState) => T): T {
  return useSyncExternalStore(
    store.subscribe,
    () => select(store.getState()),
    () => select(store.getState()),
  );
}
