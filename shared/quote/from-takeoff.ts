import type { Takeoff } from '../takeoff/takeoff-types';
import type { SpaceForQuote } from './build-lines';

/**
 * What the quote and the van load read from one space's stored takeoff artefact: the layers with
 * their chosen products and both roll counts, the exclusion counts, the boards to be raised and
 * the eaves ventilators the takeoff counted.
 */
export function spaceForQuote(spaceName: string, takeoff: Takeoff): SpaceForQuote {
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
    raisedBoardedAreaM2: takeoff.exclusions.raisedBoardedAreaM2,
    eavesVentilators: takeoff.eaves.ventilatorCount,
    yearlySaving: { kwh: takeoff.savings.fuelKwhPerYear, minor: takeoff.savings.moneyMinorPerYear },
  };
}
