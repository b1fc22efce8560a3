/** Yearly saving from a lower U-value. Energy in kWh, money in minor units. */
export interface SavingsEstimate {
  /** Area the improvement applies to, m². */
  areaM2: number;
  /** U before − U after, W/m²K (0 when nothing improves). */
  deltaU: number;
  /** Heat no longer lost, kWh a year. */
  heatKwhPerYear: number;
  /** Fuel no longer bought: heat / efficiency, kWh a year. */
  fuelKwhPerYear: number;
  /** Fuel kWh × price, rounded to whole minor units a year. */
  moneyMinorPerYear: number;
}

/**
 * Yearly saving by the degree-day method (CIBSE TM41:2006 "Degree-days: theory and application"):
 * heat kWh = ΔU × area × degree days × 24 / 1000; fuel = heat / efficiency; money = fuel × price.
 * The 15.5 °C base temperature of the degree days already allows for typical internal and solar
 * gains; partial heating is not modelled: present it as an estimate. A negative ΔU is no saving.
 */
export function yearlySavings(
  uBefore: number,
  uAfter: number,
  areaM2: number,
  degreeDays: number,
  heatingEfficiency: number,
  fuelPriceMinorPerKwh: number,
): SavingsEstimate {
  const deltaU = Math.max(0, uBefore - uAfter);
  const heatKwhPerYear = (deltaU * areaM2 * degreeDays * 24) / 1000;
  const fuelKwhPerYear = heatingEfficiency > 0 ? heatKwhPerYear / heatingEfficiency : 0;
  return { areaM2, deltaU, heatKwhPerYear, fuelKwhPerYear, moneyMinorPerYear: Math.round(fuelKwhPerYear * fuelPriceMinorPerKwh) };
}

/**
 * Simple payback in years: cost (a quote's gross total) / yearly saving, both minor units, to one
 * decimal (plenty for an estimate); `null` when nothing is saved.
 */
export function paybackYears(costMinor: number, savingMinorPerYear: number): number | null {
  if (!(savingMinorPerYear > 0)) return null;
  return Math.round((costMinor / savingMinorPerYear) * 10) / 10;
}
