import { cmd, moveJoistOffset, setJoists } from '../commands';
import { useEditor, useEditorSelect } from './editor-context';
import { NumberField } from './number-field';

const COMMON_CENTRES = [400, 450, 600];

/** Joists step: angle, centres (common choices), width, depth and the first joist's offset. */
export function JoistsTools() {
  const editor = useEditor();
  const j = useEditorSelect((s) => s.plan.joists);
  const set = (label: string, patch: Parameters<typeof setJoists>[1]) => editor.store.dispatch(cmd(label, setJoists, patch));
  return (
    <div className="flex flex-wrap items-end gap-3">
      <NumberField label="Angle" unit="°" value={j.angleDeg} testId="joist-angle" className="w-24" onCommit={(v) => set('joist angle', { angleDeg: v })} />
      <div className="flex flex-col gap-0.5 text-xs text-graphite-light">
        <span>Centres</span>
        <div className="flex gap-1">
          {COMMON_CENTRES.map((c) => (
            <button
              key={c}
              type="button"
              data-testid={`centres-${c}`}
              onClick={() => set('joist centres', { centresMm: c })}
              className={`h-8 rounded border px-2 font-mono text-sm ${j.centresMm === c ? 'border-timber bg-timber text-white' : 'border-graphite/25 bg-white text-graphite'}`}
            >
              {c}
            </button>
          ))}
        </div>
      </div>
      <NumberField
        label="Other centres"
        unit="mm"
        value={j.centresMm}
        testId="joist-centres"
        className="w-28"
        onCommit={(v) => set('joist centres', { centresMm: v })}
      />
      <NumberField label="Joist width" unit="mm" value={j.widthMm} testId="joist-width" className="w-28" onCommit={(v) => set('joist width', { widthMm: v })} />
      <NumberField label="Joist depth" unit="mm" value={j.depthMm} testId="joist-depth" className="w-28" onCommit={(v) => set('joist depth', { depthMm: v })} />
      <NumberField
        label="First joist at"
        unit="mm"
        value={j.offsetMm}
        testId="joist-offset"
        className="w-28"
        onCommit={(v) => editor.store.dispatch(cmd('move joists', moveJoistOffset, { offsetMm: v }))}
      />
    </div>
  );
}
