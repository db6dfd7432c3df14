/** The members feature's public surface. */
export { addMember, findRole } from './members.service';
