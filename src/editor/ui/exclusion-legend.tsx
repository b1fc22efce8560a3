import { type ExclusionKind } from '../../../shared/plan/plan-schema';
import { KIND_STYLES, PALETTE } from '../canvas/palette';

/** A small swatch drawn the same way as the canvas hatches that kind. */
export function KindSwatch({ kind, size = 18 }: { kind: ExclusionKind; size?: number }) {
  const st = KIND_STYLES[kind];
  const id = `sw-${kind}`;
  if (kind === 'downlight') {
    return (
      <svg width={size} height={size} viewBox="0 0 18 18" aria-hidden>
        <circle cx="9" cy="9" r="7" fill={PALETTE.brickLight} stroke={PALETTE.brick} />
        <path d="M4.5 4.5l9 9M13.5 4.5l-9 9" stroke={PALETTE.brick} strokeWidth="1.5" />
      </svg>
    );
  }
  return (
    <svg width={size} height={size} viewBox="0 0 18 18" aria-hidden>
      <defs>
        {st.angles.map((a, i) => (
          <pattern key={i} id={`${id}-${i}`} width={st.spacingPx} height={st.spacingPx} patternUnits="userSpaceOnUse" patternTransform={`rotate(${a})`}>
            <line x1="0" y1="0" x2={st.spacingPx} y2="0" stroke={PALETTE.brick} strokeWidth="1" />
          </pattern>
        ))}
      </defs>
      <rect x="1" y="1" width="16" height="16" fill={PALETTE.brickLight} fillOpacity="0.45" />
      {st.angles.map((_, i) => (
        <rect key={i} x="1" y="1" width="16" height="16" fill={`url(#${id}-${i})`} />
      ))}
      <rect x="1" y="1" width="16" height="16" fill="none" stroke={PALETTE.brick} strokeWidth="1.5" strokeDasharray={st.dash.join(' ')} />
    </svg>
  );
}
