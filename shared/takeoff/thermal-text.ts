import type { Takeoff } from './takeoff-types';

const u = (x: number) => x.toFixed(2);

type ThermalFacts = Pick<Takeoff, 'uValueBefore' | 'uValueAfter' | 'uValueBeforeWholeCeiling' | 'uValueAfterWholeCeiling' | 'thermal' | 'target'>;

/**
 * The target and the figure it is judged on, in words: "target U 0.16 W/m²K judged on the whole
 * ceiling: met", or for a depth target "target 270 mm of insulation: not met".
 */
export function thermalTargetText(t: Pick<ThermalFacts, 'thermal' | 'target'>): string {
  const met = t.thermal.meetsTarget ? 'met' : 'not met';
  if (t.thermal.targetJudgedOn === 'depth') return `target ${'depthMm' in t.target ? t.target.depthMm : '?'} mm of insulation: ${met}`;
  const on = t.thermal.targetJudgedOn === 'whole-ceiling' ? 'the whole ceiling' : 'the insulated area';
  return `target U ${t.thermal.targetUValue} W/m²K judged on ${on} (ISO 6946): ${met}`;
}

/**
 * The U-values of a takeoff in one line for documents, each figure named: the BS EN ISO 6946
 * combined-method value of the insulated area and of the whole ceiling (area-weighted), the
 * RdSAP 2012 Table S9 default for the same depth beside them, and which one the target is judged
 * on. U in W/m²K, before → after.
 */
export function thermalFactsText(t: ThermalFacts): string {
  return (
    `U-value (BS EN ISO 6946 combined method) ${u(t.uValueBefore)} → ${u(t.uValueAfter)} W/m²K insulated area, ` +
    `${u(t.uValueBeforeWholeCeiling)} → ${u(t.uValueAfterWholeCeiling)} whole ceiling; ` +
    `RdSAP 2012 Table S9 default ${u(t.thermal.before.rdsapU)} → ${u(t.thermal.after.rdsapU)}; ` +
    thermalTargetText(t)
  );
}
