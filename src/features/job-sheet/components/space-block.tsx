import { lazy, Suspense, useMemo, useState } from 'react';
import type { JobPhoto, PhotoStage, SheetSpace, TickKind } from '../../../../shared/api/job-sheet';
import { tickKey, type PendingPhoto, type ShownTick } from '../merge-pending';
import { CutList } from './cut-list';
import { PhotosPanel } from './photos-panel';
import { SheetSection } from './sheet-section';
import { SiteChecks } from './site-checks';

// The plan drawing loads on its own, after the text the installer needs first.
const PlanView = lazy(() => import('./plan-view'));

type Props = {
  space: SheetSpace;
  ticks: Map<string, ShownTick>;
  photos: JobPhoto[];
  pendingPhotos: PendingPhoto[];
  canRecord: boolean;
  onTick: (kind: TickKind, ref: string, done: boolean, reason?: string) => void;
  onPhoto: (file: File, stage: PhotoStage, caption: string) => void;
};

/** One loft space: its plan, site checks, cut list and photos. */
export function SpaceBlock({ space, ticks, photos, pendingPhotos, canRecord, onTick, onPhoto }: Props) {
  const [layerKey, setLayerKey] = useState<string | null>(space.layers[0]?.key ?? null);
  const laid = useMemo(
    () => new Set(space.layers.flatMap((l) => l.strips.filter((s) => ticks.get(tickKey('strip-laid', space.id, s.id))?.done).map((s) => s.id))),
    [space, ticks],
  );
  const checksDone = space.checks.filter((c) => {
    const t = ticks.get(tickKey('check', space.id, c.code));
    return t?.done || !!t?.reason;
  }).length;
  const noop = () => undefined;

  return (
    <section aria-labelledby={`space-${space.id}`} className="mb-4">
      <h2 id={`space-${space.id}`} className="mb-2 mt-5 border-b-4 border-graphite pb-1 text-2xl font-bold">
        {space.name}
      </h2>
      {space.problem && (
        <p className="mb-3 rounded-md border-2 border-brick bg-brick-light/30 px-3 py-2 text-lg font-semibold text-brick-dark">{space.problem}</p>
      )}
      {space.netAreaM2 !== null && (
        <p className="mb-2 text-base">
          Net area <strong>{space.netAreaM2.toFixed(1)} m²</strong>
          {space.uValueBefore !== null && space.uValueAfter !== null && (
            <>
              {' · '}U {space.uValueBefore.toFixed(2)} → <strong>{space.uValueAfter.toFixed(2)}</strong> W/m²K
            </>
          )}
        </p>
      )}
      {space.thermalText && <p className="mb-2 text-sm text-graphite-light">{space.thermalText}</p>}

      {space.plan && (
        <SheetSection title="Plan" defaultOpen>
          {space.layers.length > 1 && (
            <div role="radiogroup" aria-label="Layer shown on the plan" className="mb-2 flex flex-wrap gap-2">
              {space.layers.map((l) => (
                <button
                  key={l.key}
                  type="button"
                  role="radio"
                  aria-checked={layerKey === l.key}
                  onClick={() => setLayerKey(l.key)}
                  className={`min-h-11 rounded-md border-2 px-3 text-base font-bold ${layerKey === l.key ? 'border-graphite bg-graphite text-white' : 'border-graphite/40 bg-white'}`}
                >
                  {l.label}
                </button>
              ))}
            </div>
          )}
          <Suspense fallback={<div className="h-72 rounded-md border-2 border-graphite/20 bg-white" aria-busy="true" />}>
            <PlanView space={space} layerKey={layerKey} laid={laid} />
          </Suspense>
          <p className="mt-2 text-base">
            Strips are numbered in laying order, from the eaves inward, finishing at the hatch; laid strips turn dark. Drag to move, pinch to zoom.
          </p>
        </SheetSection>
      )}

      <SheetSection title={`Site checks (${checksDone}/${space.checks.length})`} defaultOpen testId={`checks-${space.id}`}>
        <SiteChecks space={space} ticks={ticks} onCheck={canRecord ? (code, done, reason) => onTick('check', code, done, reason) : noop} />
      </SheetSection>

      <SheetSection title="Cut list">
        <CutList space={space} ticks={ticks} onTick={canRecord ? (kind, ref, done) => onTick(kind, ref, done) : noop} />
      </SheetSection>

      <SheetSection title="Photos">
        <PhotosPanel space={space} photos={photos} pending={pendingPhotos} onAdd={onPhoto} disabled={!canRecord} />
      </SheetSection>
    </section>
  );
}
