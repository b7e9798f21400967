// React access to the open sheet's editor and its live solve.
import { createContext, useContext } from 'react';
import { useStore } from 'zustand';
import type { Editor } from './store/actions';
import type { EditorState } from './store/editorStore';
import type { LiveSolve, LiveSolveState } from './solve/liveSolve';

export interface EditorContextValue {
  editor: Editor;
  live: LiveSolve;
}

export const EditorContext = createContext<EditorContextValue | null>(null);

export function useEditorContext(): EditorContextValue {
  const ctx = useContext(EditorContext);
  if (!ctx) throw new Error('useEditorContext must be used inside <EditorContext.Provider>');
  return ctx;
}

/** The editor (store + actions). */
export function useEditor(): Editor {
  return useEditorContext().editor;
}

/** Subscribe to a slice of the editor state. */
export function useEditorState<T>(selector: (s: EditorState) => T): T {
  return useStore(useEditorContext().editor.store, selector);
}

/** Subscribe to a slice of the live solve. */
export function useSolveState<T>(selector: (s: LiveSolveState) => T): T {
  return useStore(useEditorContext().live.store, selector);
}
