/** The members feature's public surface. */
export { addMember, anOwnerId, findRole, names } from './members.service';
