import { createContext, useContext } from 'react';
import type { Editor } from '../create-editor';
import type { EditorState } from '../store/editor-store';
import { useEditorState } from '../store/use-editor-state';

export const EditorContext = createContext<Editor | null>(null);

export function useEditor(): Editor {
  const e = useContext(EditorContext);
  if (!e) throw new Error('useEditor outside <EditorContext.Provider>');
  return e;
}

/** A slice of the editor state for this component. */
export function useEditorSelect<T>(select: (s: EditorState) => T): T {
  return useEditorState(useEditor().store, select);
}
