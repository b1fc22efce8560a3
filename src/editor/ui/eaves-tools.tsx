import { cmd, setEavesGap } from '../commands';
import { useEditor, useEditorSelect } from './editor-context';
import { NumberField } from './number-field';

/** Eaves step: which edges are marked, and the ventilation gap. */
export function EavesTools() {
  const editor = useEditor();
  const gap = useEditorSelect((s) => s.plan.eavesGapMm);
  const edges = useEditorSelect((s) => s.plan.eavesEdges);
  return (
    <div className="flex flex-wrap items-end gap-4">
      <NumberField
        label="Ventilation gap"
        unit="mm"
        value={gap}
        testId="eaves-gap"
        className="w-32"
        onCommit={(v) => editor.store.dispatch(cmd('eaves gap', setEavesGap, { gapMm: v }))}
      />
      <p className="max-w-xl text-xs text-graphite-light">
        Eaves edges: <span className="font-mono">{edges.length ? edges.map((e) => e + 1).join(', ') : 'none yet'}</span>. Keep the air path from the eaves open
        — commonly a gap equivalent to 50 mm continuous (BRE BR 262); follow BS 5250 and local building regulations for your roof.
      </p>
    </div>
  );
}
