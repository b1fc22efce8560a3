import type { Takeoff } from '../takeoff/takeoff-types';
import type { SpaceForQuote } from './build-lines';

/**
 * What the quote and the van load read from one space's stored takeoff artefact: the layers with
 * their chosen products and both roll counts, the exclusion counts, the boarded area and the
 * eaves length. Rafter spacing along the eaves is taken as the plan's joist centres (common
 * practice), 400 mm when the plan gives none.
 */
export function spaceForQuote(spaceName: string, takeoff: Takeoff, joistCentresMm: number | undefined): SpaceForQuote {
  return {
    spaceName,
    layers: takeoff.layers.map((l) => ({
      role: l.role,
      productId: l.productId,
      productName: l.productName,
      areaM2: l.areaM2,
      rollsByPacking: l.rollsByPacking,
      rollsByArea: l.rollsByArea,
    })),
    exclusionCounts: { ...takeoff.exclusions.countsByKind },
    boardedAreaM2: takeoff.exclusions.boardedAreaM2,
    eavesLengthMm: takeoff.eaves.totalLengthMm,
    rafterCentresMm: joistCentresMm ?? 400,
    yearlySaving: { kwh: takeoff.savings.fuelKwhPerYear, minor: takeoff.savings.moneyMinorPerYear },
  };
}
