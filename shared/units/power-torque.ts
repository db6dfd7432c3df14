/**
 * The power–torque identity, from the definition of power P = 2πnT/60
 * (n in rev/min). With 1 hp = 550 ft·lbf/s = 33 000 ft·lbf/min this is
 * hp = T[lbf·ft] × rpm / 5252.113…, and in SI kW = T[N·m] × rpm / 9549.297….
 */
import { HP_TORQUE_RPM_CONSTANT, KW_TORQUE_RPM_CONSTANT } from './constants';
import { convertPower, convertTorque, type PowerUnit, type TorqueUnit } from './convert';

/** hp from lbf·ft at an engine speed: T × rpm / 5252.1131 (33000/2π). */
export function hpFromLbft(torqueLbft: number, rpm: number): number {
  return (torqueLbft * rpm) / HP_TORQUE_RPM_CONSTANT;
}

/** lbf·ft from hp at an engine speed: P × 5252.1131 / rpm (33000/2π). */
export function lbftFromHp(powerHp: number, rpm: number): number {
  return (powerHp * HP_TORQUE_RPM_CONSTANT) / rpm;
}

/** kW from N·m at an engine speed: T × rpm / 9549.2966 (60000/2π). */
export function kwFromNm(torqueNm: number, rpm: number): number {
  return (torqueNm * rpm) / KW_TORQUE_RPM_CONSTANT;
}

/** N·m from kW at an engine speed: P × 9549.2966 / rpm (60000/2π). */
export function nmFromKw(powerKw: number, rpm: number): number {
  return (powerKw * KW_TORQUE_RPM_CONSTANT) / rpm;
}

/** Power in any power unit from a torque in any torque unit at an engine speed. */
export function powerFromTorque(
  torque: number,
  torqueUnit: TorqueUnit,
  rpm: number,
  powerUnit: PowerUnit,
): number {
  return convertPower(kwFromNm(convertTorque(torque, torqueUnit, 'n-m'), rpm), 'kw', powerUnit);
}

/** Torque in any torque unit from a power in any power unit at an engine speed. */
export function torqueFromPower(
  power: number,
  powerUnit: PowerUnit,
  rpm: number,
  torqueUnit: TorqueUnit,
): number {
  return convertTorque(nmFromKw(convertPower(power, powerUnit, 'kw'), rpm), 'n-m', torqueUnit);
}
