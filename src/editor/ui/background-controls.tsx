import { useRef, useState } from 'react';
import { calibrateBackground, cmd, setBackground } from '../commands';
import { useEditor, useEditorSelect } from './editor-context';

type Props = { onUpload?: (file: File) => Promise<{ url: string }> };

/** The toolbar's underlay button: upload or replace the image (its settings float on the canvas). */
export function UnderlayButton({ onUpload }: Props) {
  const editor = useEditor();
  const bg = useEditorSelect((s) => s.plan.background);
  const file = useRef<HTMLInputElement>(null);
  const [busy, setBusy] = useState(false);
  const d = editor.store.dispatch;

  const upload = async (f: File) => {
    if (!onUpload) return;
    setBusy(true);
    try {
      const { url } = await onUpload(f);
      // Start at 10 mm per image pixel; calibrate to set the true scale.
      d(cmd('background', setBackground, { background: { url, mmPerPx: 10, originMm: [0, 0], opacity: 0.5, locked: false } }));
    } catch (e) {
      editor.store.setError((e as Error).message);
    } finally {
      setBusy(false);
    }
  };

  if (!onUpload) return null;
  return (
    <>
      <input
        ref={file}
        type="file"
        accept="image/png,image/jpeg,image/webp"
        className="hidden"
        data-testid="background-file"
        onChange={(e) => {
          const f = e.target.files?.[0];
          if (f) void upload(f);
          e.target.value = '';
        }}
      />
      <button
        type="button"
        className="h-8 shrink-0 rounded border border-graphite/25 bg-white px-2 text-sm"
        disabled={busy}
        onClick={() => file.current?.click()}
      >
        {busy ? 'Uploading…' : bg ? 'Replace underlay' : 'Underlay'}
      </button>
    </>
  );
}

/** Over the canvas while there is an underlay: two-point calibration, opacity, lock, remove. */
export function UnderlayPanel() {
  const editor = useEditor();
  const bg = useEditorSelect((s) => s.plan.background);
  const calibration = useEditorSelect((s) => s.session.calibration);
  const calibrating = useEditorSelect(() => editor.isCalibrating());
  const [realMm, setRealMm] = useState('');
  const d = editor.store.dispatch;
  if (!bg) return null;
  return (
    <div className="flex flex-wrap items-center gap-2 rounded border border-graphite/20 bg-paper/95 px-2 py-1 text-sm shadow" data-testid="underlay-panel">
      <span className="text-xs text-graphite-light">Underlay</span>
      {
        <>
          <button
            type="button"
            className={`h-8 rounded border px-2 ${calibrating ? 'border-teal bg-teal-light' : 'border-graphite/25 bg-white'}`}
            disabled={bg.locked}
            onClick={() => editor.setCalibrating(!calibrating)}
          >
            {calibrating ? (calibration ? 'Type the distance' : 'Click two points…') : 'Calibrate'}
          </button>
          {calibration && (
            <form
              className="flex items-center gap-1"
              onSubmit={(e) => {
                e.preventDefault();
                if (d(cmd('calibrate background', calibrateBackground, { ...calibration, realMm: Number(realMm) }))) {
                  editor.setCalibrating(false);
                  setRealMm('');
                }
              }}
            >
              <input
                autoFocus
                className="h-8 w-24 rounded border border-graphite/25 px-2 font-mono"
                placeholder="real mm"
                value={realMm}
                onChange={(e) => setRealMm(e.target.value)}
                onKeyDown={(e) => e.stopPropagation()}
              />
              <button type="submit" className="h-8 rounded bg-teal-dark px-2 text-white">
                Set scale
              </button>
            </form>
          )}
          <label className="flex items-center gap-1">
            Opacity
            <input
              type="range"
              min={0.1}
              max={1}
              step={0.05}
              value={bg.opacity}
              disabled={bg.locked}
              onChange={(e) => d(cmd('background opacity', setBackground, { background: { opacity: Number(e.target.value) } }), { history: 'gesture' })}
              onPointerUp={() => editor.store.endGesture()}
              onKeyUp={() => editor.store.endGesture()}
            />
          </label>
          <label className="flex items-center gap-1">
            <input
              type="checkbox"
              checked={bg.locked}
              onChange={(e) => d(cmd('lock background', setBackground, { background: { locked: e.target.checked } }))}
            />
            Lock
          </label>
          <button
            type="button"
            className="h-8 rounded px-2 text-brick hover:bg-brick-light/40"
            disabled={bg.locked}
            onClick={() => d(cmd('remove background', setBackground, { background: null }))}
          >
            Remove
          </button>
        </>
      }
    </div>
  );
}
