import type { Design } from '../../shared/design';
import type { RequirementsSummary, VersionSummary } from '../../shared/notebooks';
import { evaluateDesign, evaluatePoint, prepareDesign } from '../../features/solver/index';
import { checkRequirements, hasRequirements } from '../../features/requirements/index';

/**
 * How the design stands against its own requirements, for the history row and compare: the same
 * checks the workbench runs. Null when the design states none.
 */
export function summarizeRequirements(design: Design): RequirementsSummary | null {
  if (!hasRequirements(design)) return null;
  const report = checkRequirements(design);
  return {
    met: report.passed,
    total: report.checks.length,
    unknown: report.unknown,
    failing: report.checks.filter((check) => check.status === 'fail').map((check) => check.id),
  };
}

/**
 * The key figures a version's history row shows, computed once when the version is written so
 * that no read runs the solver. Warnings come from the solver's default sweep, the same one the
 * workbench's read-out uses, so the count matches what the designer saw.
 */
export function summarizeVersion(design: Design): VersionSummary {
  const evaluation = evaluateDesign(design);
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const centre = evaluatePoint(prepareDesign(design), centreNm);
  const requirements = summarizeRequirements(design);
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
    // Left out, not null, for a design without requirements: its summary stays as it was before
    // requirements existed, byte for byte.
    ...(requirements ? { requirements } : {}),
  };
}
