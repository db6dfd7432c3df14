import { estimate } from '@shared/estimate';
import type { EstimateResult } from '@shared/schemas/estimate';

/**
 * The estimate the server would give if the build's target were `powerHp` (in the build's
 * basis), worked out in the browser by the same shared function from the saved estimate's own
 * parts and assumptions. Null when the figure cannot be computed (e.g. not above zero).
 */
export function whatIfEstimate(saved: EstimateResult, powerHp: number): EstimateResult | null {
  const a = saved.assumptions;
  try {
    const result = estimate(
      {
        target: { powerHp, basis: saved.target.basis, torqueLbft: saved.target.torqueLbft },
        assumptions: {
          bsfc: a.bsfc,
          bsfcUnit: a.bsfcUnit,
          afr: a.afr,
          fuelDensityKgPerL: a.fuelDensityKgPerL,
          drivetrainLossPct: a.drivetrainLossPct,
          peakRpm: a.peakRpm,
          cylinders: a.cylinders,
          tightMarginPct: a.tightMarginPct,
        },
        components: saved.components.map((c) => ({
          id: c.id,
          name: c.name,
          category: c.category,
          quantity: c.quantity,
          ratingValue: c.ratingValue,
          ratingUnit: c.ratingUnit,
          ...(c.ratingFor ? { ratingFor: c.ratingFor } : {}),
          ...(c.anonymised ? { anonymised: true } : {}),
        })),
      },
      { cylindersFrom: a.cylindersFrom },
    );
    // Parts whose stored rating cannot be checked are not in saved.components; their
    // warnings do not depend on the target, so they carry over as the server gave them.
    const unusable = saved.warnings.filter((w) => w.code === 'rating-unusable');
    if (unusable.length) {
      const dangers = result.warnings.filter((w) => w.severity === 'danger');
      const rest = result.warnings.filter((w) => w.severity !== 'danger');
      result.warnings = [...dangers, ...unusable, ...rest];
    }
    return result;
  } catch {
    return null;
  }
}

/** Slider ends: from half the saved target to well past what the parts support, in 5 hp steps. */
export function whatIfRange(saved: EstimateResult): { min: number; max: number } {
  const target = saved.target.powerHp;
  const supported = saved.supported
    ? saved.target.basis === 'crank'
      ? saved.supported.crankPower.value
      : saved.supported.wheelPower.value
    : target;
  const round5 = (x: number) => Math.round(x / 5) * 5;
  const min = Math.max(5, round5(target * 0.5));
  const max = Math.min(5000, Math.max(round5(target * 1.5), round5(supported * 1.25)));
  return { min, max: Math.max(max, min + 5) };
}
