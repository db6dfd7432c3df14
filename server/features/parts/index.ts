/** The parts feature's public surface: what other features may call. */
export { getVisible, listAll, listMoney, seesPart } from './parts.service';
export type { PartRecord } from './parts.repository';
export { createOverdueWorker, notifyOverdueParts, type OverdueWorker } from './parts.overdue';
