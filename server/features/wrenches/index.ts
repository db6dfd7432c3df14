/** The wrenches feature's public surface: the wrench a torque reading names. */
export { wrenchForReading } from './wrenches.service';
