/**
 * The fuel, air and power chains of ../shared/reference.md ("Fuel, air and
 * power"), as small pure functions the estimator composes. Four-stroke engine:
 * one injection per cylinder every two revolutions.
 */
import { POUND_KG } from '@shared/units/constants';

/**
 * 120 = 60 s/min × 2 revolutions per injection (four-stroke cycle): a cylinder
 * injects rpm / 120 times a second.
 */
export const FOUR_STROKE_SECONDS_FACTOR = 120;

/** Injections per second across the engine: cylinders × rpm / 120 (four-stroke). */
export function injectionsPerSecond(cylinders: number, rpm: number): number {
  return (cylinders * rpm) / FOUR_STROKE_SECONDS_FACTOR;
}

/**
 * Fuel mass flow from injector delivery: ṁ[g/s] = V[mm³/stroke] × ρ[kg/L] / 1000 × cylinders × rpm / 120.
 * (1 mm³ of fuel at ρ kg/L weighs ρ mg.) reference.md, "fuel from injectors".
 */
export function fuelGPerSFromDelivery(
  deliveryMm3PerStroke: number,
  densityKgPerL: number,
  cylinders: number,
  rpm: number,
): number {
  return ((deliveryMm3PerStroke * densityKgPerL) / 1000) * injectionsPerSecond(cylinders, rpm);
}

/** The delivery per injector per stroke a fuel mass flow needs: the inverse of {@link fuelGPerSFromDelivery}. */
export function deliveryFromFuelGPerS(
  fuelGPerS: number,
  densityKgPerL: number,
  cylinders: number,
  rpm: number,
): number {
  return (fuelGPerS * 1000) / densityKgPerL / injectionsPerSecond(cylinders, rpm);
}

/** Brake power a fuel flow makes: P[kW] = ṁ[kg/h] × 1000 / BSFC[g/kWh]. reference.md. */
export function powerKwFromFuelKgPerH(fuelKgPerH: number, bsfcGPerKwh: number): number {
  return (fuelKgPerH * 1000) / bsfcGPerKwh;
}

/** Fuel a brake power burns: ṁ[kg/h] = P[kW] × BSFC[g/kWh] / 1000. */
export function fuelKgPerHFromPowerKw(powerKw: number, bsfcGPerKwh: number): number {
  return (powerKw * bsfcGPerKwh) / 1000;
}

/**
 * Fuel an air flow can burn at an air–fuel ratio: ṁ_fuel[kg/h] = lb/min × 0.45359237 × 60 / AFR.
 * lb = 0.45359237 kg exactly (NIST SP 811 (2008) B.8). reference.md, "fuel from air".
 */
export function fuelKgPerHFromAirLbPerMin(airLbPerMin: number, afr: number): number {
  return (airLbPerMin * POUND_KG * 60) / afr;
}

/** Air a fuel flow needs at an air–fuel ratio, in lb/min: the inverse of {@link fuelKgPerHFromAirLbPerMin}. */
export function airLbPerMinFromFuelKgPerH(fuelKgPerH: number, afr: number): number {
  return (fuelKgPerH * afr) / POUND_KG / 60;
}

/** Excess-air ratio λ = AFR / stoichiometric AFR. */
export function lambdaFromAfr(afr: number, stoichiometricAfr: number): number {
  return afr / stoichiometricAfr;
}
