import type { Design } from '../../shared/design';
import type { VersionSummary } from '../../shared/notebooks';
import { evaluateDesign, evaluatePoint, prepareDesign } from '../../features/solver/index';

/**
 * The key figures a version's history row shows, computed once when the version is written so
 * that no read runs the solver. Warnings come from the solver's default sweep, the same one the
 * workbench's read-out uses, so the count matches what the designer saw.
 */
export function summarizeVersion(design: Design): VersionSummary {
  const evaluation = evaluateDesign(design);
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const centre = evaluatePoint(prepareDesign(design), centreNm);
  return {
    rangeStartNm: design.range.startNm,
    rangeEndNm: design.range.endNm,
    centreWavelengthNm: centreNm,
    centreReachable: centre.reachable,
    bandpassAtCentreNm: centre.bandpassNm,
    resolvingPowerAtCentre: centre.resolvingPower,
    reciprocalDispersionAtCentreNmPerMm: centre.reciprocalDispersionNmPerMm,
    fNumber: evaluation.design.fNumberProjectedWidth,
    warningCount: evaluation.warnings.length,
  };
}
