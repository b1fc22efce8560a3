import { type ExclusionKind } from '../../../shared/plan/plan-schema';
import { KIND_STYLES } from '../canvas/palette';

/** A small swatch drawn the same way as the canvas hatches that kind. */
export function KindSwatch({ kind, size = 18 }: { kind: ExclusionKind; size?: number }) {
  const st = KIND_STYLES[kind];
  const id = `sw-${kind}`;
  if (kind === 'downlight') {
    return (
      <svg width={size} height={size} viewBox="0 0 18 18" aria-hidden>
        <circle cx="9" cy="9" r="7" fill={st.fill} stroke={st.ink} />
        <path d="M4.5 4.5l9 9M13.5 4.5l-9 9" stroke={st.ink} strokeWidth="1.5" />
      </svg>
    );
  }
  return (
    <svg width={size} height={size} viewBox="0 0 18 18" aria-hidden>
      <defs>
        {st.angles.map((a, i) => (
          <pattern key={i} id={`${id}-${i}`} width={st.spacingPx} height={st.spacingPx} patternUnits="userSpaceOnUse" patternTransform={`rotate(${a})`}>
            <line x1="0" y1="0" x2={st.spacingPx} y2="0" stroke={st.ink} strokeWidth="1" />
          </pattern>
        ))}
      </defs>
      <rect x="1" y="1" width="16" height="16" fill={st.fill} fillOpacity="0.6" />
      {st.angles.map((_, i) => (
        <rect key={i} x="1" y="1" width="16" height="16" fill={`url(#${id}-${i})`} />
      ))}
      <rect x="1" y="1" width="16" height="16" fill="none" stroke={st.ink} strokeWidth="1.5" strokeDasharray={st.dash.join(' ')} />
    </svg>
  );
}
