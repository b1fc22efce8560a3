import type { EavesMode } from '../../../shared/plan/plan-schema';
import { cmd, setEavesGap, setEavesMode, setRoof } from '../commands';
import { useEditor, useEditorSelect } from './editor-context';
import { NumberField } from './number-field';

const selectClass = 'h-8 rounded border border-graphite/25 bg-white px-1 text-sm text-graphite';

/**
 * Eaves step: which edges are marked, how the air path is kept open (the company's mode, named,
 * unless the plan chooses), and the roof notes the ventilation checks read.
 */
export function EavesTools({ companyMode = 'gap' }: { companyMode?: EavesMode }) {
  const editor = useEditor();
  const d = editor.store.dispatch;
  const gap = useEditorSelect((s) => s.plan.eavesGapMm);
  const edges = useEditorSelect((s) => s.plan.eavesEdges);
  const mode = useEditorSelect((s) => s.plan.eavesMode);
  const roof = useEditorSelect((s) => s.plan.roof);
  return (
    <div className="flex flex-wrap items-end gap-4">
      <label className="flex flex-col text-xs text-graphite-light">
        At the eaves
        <select
          className={selectClass}
          value={mode ?? ''}
          data-testid="eaves-mode"
          onChange={(e) => d(cmd('eaves mode', setEavesMode, { mode: (e.target.value || undefined) as EavesMode | undefined }))}
        >
          <option value="">company default ({companyMode === 'ventilators' ? 'eaves ventilators' : 'a gap'})</option>
          <option value="gap">keep a gap back</option>
          <option value="ventilators">eaves ventilators, over the wall plate</option>
        </select>
      </label>
      {(mode ?? companyMode) !== 'ventilators' && (
        <NumberField
          label="Ventilation gap"
          unit="mm"
          value={gap}
          testId="eaves-gap"
          className="w-32"
          onCommit={(v) => d(cmd('eaves gap', setEavesGap, { gapMm: v }))}
        />
      )}
      <label className="flex flex-col text-xs text-graphite-light">
        Roof
        <select
          className={selectClass}
          value={roof?.shape ?? ''}
          data-testid="roof-shape"
          onChange={(e) => d(cmd('roof shape', setRoof, { shape: (e.target.value || undefined) as 'gable' | 'hipped' | 'mono-pitch' | undefined }))}
        >
          <option value="">not noted</option>
          <option value="gable">gable</option>
          <option value="hipped">hipped</option>
          <option value="mono-pitch">mono-pitch</option>
        </select>
      </label>
      <NumberField
        label="Pitch"
        unit="°"
        value={roof?.pitchDeg ?? 0}
        testId="roof-pitch"
        className="w-24"
        onCommit={(v) => d(cmd('roof pitch', setRoof, { pitchDeg: v > 0 ? v : undefined }))}
      />
      <p className="max-w-xl text-xs text-graphite-light">
        Eaves edges: <span className="font-mono">{edges.length ? edges.map((e) => e + 1).join(', ') : 'none yet'}</span>. Keep the air path from the eaves open:
        either keep the insulation back (commonly a gap equivalent to 50 mm continuous, BRE BR 262 — the bare edge is cold and can grow mould) or fit an eaves
        ventilator in each rafter space and run the insulation over the wall plate. Follow BS 5250:2021 and local building regulations for your roof.
      </p>
    </div>
  );
}
