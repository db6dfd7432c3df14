/** The auth feature's public surface: accounts looked up and created by other features. */
export { createUser, findUserByEmail } from './auth.service';
