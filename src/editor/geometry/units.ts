import type { Units } from '../store/session';

const MM_PER_IN = 25.4;

/** A length for display: whole millimetres, or feet and inches to the nearest 1/8 in. */
export function formatLength(mm: number, units: Units): string {
  if (units === 'metric') return `${Math.round(mm)}`;
  if (mm < 0) return `−${formatLength(-mm, units)}`;
  const eighths = Math.round((mm / MM_PER_IN) * 8);
  const ft = Math.floor(eighths / 96);
  const rest = eighths - ft * 96;
  const inches = Math.floor(rest / 8);
  let frac = rest % 8;
  let den = 8;
  while (frac > 0 && frac % 2 === 0) {
    frac /= 2;
    den /= 2;
  }
  return `${ft}′ ${inches}${frac ? ` ${frac}/${den}` : ''}″`;
}

/** An area: m² or ft². */
export function formatArea(m2: number, units: Units): string {
  return units === 'metric' ? `${m2.toFixed(2)} m²` : `${(m2 * 10.7639).toFixed(1)} ft²`;
}
