import { useEditor, useEditorSelect } from './editor-context';

const SHORTCUTS: [string, string][] = [
  ['1 – 6', 'go to a step: outline, joists, exclusions, eaves, layers, review'],
  ['Ctrl+Z', 'undo'],
  ['Ctrl+Shift+Z or Ctrl+Y', 'redo'],
  ['Alt (hold)', 'draw and drag freely, without grid or 45° snapping'],
  ['Click, click', 'exclusions: a rectangle from one corner to the opposite one (a polygon: a click per corner)'],
  ['Enter', 'finish the outline or polygon being drawn'],
  ['Escape', 'cancel a drag or the shape being drawn; close this sheet'],
  ['Delete / Backspace', 'delete the selected corner or exclusion'],
  ['[ / ]', 'select the previous / next corner (outline) or exclusion (exclusions)'],
  ['Arrows (Shift: ×10)', 'move the selected corner or exclusion 10 mm; with nothing selected, pan'],
  ['Add at view centre', 'exclusions: place one without a pointer, then move it with the arrows'],
  ['Wheel, pinch', 'zoom about the pointer'],
  ['Drag empty paper, two fingers', 'pan (in every step)'],
  ['F', 'fit the plan to the view'],
  ['+ / −', 'zoom in / out'],
  ['?', 'show or hide this sheet'],
];

/** The keyboard shortcuts, as a sheet over the canvas. */
export function HelpSheet() {
  const editor = useEditor();
  const open = useEditorSelect((s) => s.session.helpOpen);
  if (!open) return null;
  return (
    <div role="dialog" aria-label="Keyboard shortcuts" className="absolute inset-0 z-20 flex items-center justify-center">
      {/* A click on the dim backdrop closes, as Escape and the Close button do from the keyboard. */}
      <div aria-hidden="true" className="absolute inset-0 bg-graphite/30" onClick={() => editor.store.setSession({ helpOpen: false })} />
      <div className="relative max-w-lg rounded-lg bg-paper p-5 shadow-xl">
        <h2 className="mb-3 text-lg font-semibold">Shortcuts</h2>
        <table className="text-sm">
          <tbody>
            {SHORTCUTS.map(([k, v]) => (
              <tr key={k}>
                <td className="whitespace-nowrap py-1 pr-4 font-mono text-xs">{k}</td>
                <td>{v}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <button type="button" className="mt-4 h-8 rounded bg-graphite px-3 text-sm text-paper" onClick={() => editor.store.setSession({ helpOpen: false })}>
          Close
        </button>
      </div>
    </div>
  );
}
