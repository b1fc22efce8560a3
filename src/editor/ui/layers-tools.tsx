import { CONDITIONS, type Existing } from '../../../shared/plan/plan-schema';
import type { TakeoffProduct } from '../../../shared/takeoff/compute-takeoff';
import { cmd, setExisting, setProducts, setSiteNotes, setTarget } from '../commands';
import { useEditor, useEditorSelect } from './editor-context';
import { NumberField } from './number-field';

const selectClass = 'h-8 max-w-[15rem] rounded border border-graphite/25 bg-white px-1 text-sm text-graphite';

/** Layers step: the existing insulation, the target (depth or U-value) and the product choices. */
export function LayersTools({ products }: { products: TakeoffProduct[] }) {
  const editor = useEditor();
  const existing = useEditorSelect((s) => s.plan.existing);
  const target = useEditorSelect((s) => s.plan.target);
  const choice = useEditorSelect((s) => s.plan.products);
  const site = useEditorSelect((s) => s.plan.site);
  const d = editor.store.dispatch;
  const byDepth = 'depthMm' in target;
  const fits = (role: 'base' | 'cross') => products.filter((p) => !p.roles || p.roles.includes(role));
  const cross = choice?.crossProductIds ?? [];
  const pick = (next: { baseProductId?: string; crossProductIds?: string[] }) => {
    const merged = { ...choice, ...next };
    if (!merged.baseProductId) delete merged.baseProductId;
    if (!merged.crossProductIds?.length) delete merged.crossProductIds;
    d(cmd('products', setProducts, { products: Object.keys(merged).length ? merged : undefined }));
  };
  return (
    <div className="flex flex-wrap items-end gap-3">
      <NumberField
        label="Existing depth"
        unit="mm"
        value={existing.depthMm}
        testId="existing-depth"
        className="w-28"
        onCommit={(v) => d(cmd('existing depth', setExisting, { depthMm: v }))}
      />
      <label className="flex flex-col text-xs text-graphite-light">
        Condition
        <select
          className={selectClass}
          value={existing.condition}
          data-testid="existing-condition"
          onChange={(e) => d(cmd('existing condition', setExisting, { condition: e.target.value as Existing['condition'] }))}
        >
          {CONDITIONS.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </select>
      </label>
      <NumberField
        label="Extract-fan ducts"
        value={site?.extractFanDucts ?? 0}
        testId="extract-ducts"
        className="w-28"
        onCommit={(v) => d(cmd('extract-fan ducts', setSiteNotes, { extractFanDucts: v > 0 ? Math.round(v) : undefined }))}
      />
      <label className="flex flex-col text-xs text-graphite-light">
        Low-voltage downlights
        <select
          className={selectClass}
          value={site?.lowVoltageDownlights === undefined ? '' : String(site.lowVoltageDownlights)}
          data-testid="low-voltage"
          onChange={(e) =>
            d(cmd('low-voltage downlights', setSiteNotes, { lowVoltageDownlights: e.target.value === '' ? undefined : e.target.value === 'true' }))
          }
        >
          <option value="">not known</option>
          <option value="true">yes</option>
          <option value="false">none</option>
        </select>
      </label>
      <label className="flex flex-col text-xs text-graphite-light">
        Target
        <select
          className={selectClass}
          value={byDepth ? 'depth' : 'u'}
          onChange={(e) => d(cmd('target', setTarget, { target: e.target.value === 'depth' ? { depthMm: 270 } : { uValue: 0.16 } }))}
        >
          <option value="depth">total depth</option>
          <option value="u">U-value</option>
        </select>
      </label>
      {byDepth ? (
        <NumberField
          label="Target depth"
          unit="mm"
          value={target.depthMm}
          testId="target-depth"
          className="w-28"
          onCommit={(v) => d(cmd('target depth', setTarget, { target: { depthMm: v } }))}
        />
      ) : (
        <NumberField
          label="Target U"
          unit="W/m²K"
          step={0.01}
          value={target.uValue}
          testId="target-u"
          className="w-32"
          onCommit={(v) => d(cmd('target U', setTarget, { target: { uValue: v } }))}
        />
      )}
      <label className="flex flex-col text-xs text-graphite-light">
        Base product
        <select className={selectClass} value={choice?.baseProductId ?? ''} onChange={(e) => pick({ baseProductId: e.target.value || undefined })}>
          <option value="">choose for me</option>
          {fits('base').map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col text-xs text-graphite-light">
        Cross product
        <select
          className={selectClass}
          value={cross[0] ?? ''}
          onChange={(e) => pick({ crossProductIds: e.target.value ? [e.target.value, ...cross.slice(1)] : [] })}
        >
          <option value="">choose for me</option>
          {fits('cross').map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </select>
      </label>
      {cross.length > 0 && (
        <label className="flex flex-col text-xs text-graphite-light">
          Second cross
          <select
            className={selectClass}
            value={cross[1] ?? ''}
            onChange={(e) => pick({ crossProductIds: e.target.value ? [cross[0], e.target.value] : [cross[0]] })}
          >
            <option value="">none</option>
            {fits('cross').map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </select>
        </label>
      )}
    </div>
  );
}
