import type { Takeoff } from './takeoff-types';

const u = (x: number) => x.toFixed(2);

/**
 * The U-values of a takeoff in one line for documents, each figure named: the BS EN ISO 6946
 * combined-method value of the insulated area and of the whole ceiling (area-weighted), and the
 * RdSAP 2012 Table S9 default for the same depth beside them. U in W/m²K.
 */
export function thermalFactsText(
  t: Pick<Takeoff, 'uValueBefore' | 'uValueAfter' | 'uValueBeforeWholeCeiling' | 'uValueAfterWholeCeiling' | 'thermal'>,
): string {
  return (
    `U-value (BS EN ISO 6946 combined method) ${u(t.uValueBefore)} → ${u(t.uValueAfter)} W/m²K insulated area, ` +
    `${u(t.uValueBeforeWholeCeiling)} → ${u(t.uValueAfterWholeCeiling)} whole ceiling; ` +
    `RdSAP 2012 Table S9 default ${u(t.thermal.before.rdsapU)} → ${u(t.thermal.after.rdsapU)}`
  );
}
