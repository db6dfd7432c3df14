/** The files feature's public surface: what other features may call. */
export {
  createFileWorker,
  discard,
  pendingKeys,
  purge,
  purgeSoon,
  type FilesCtx,
} from './files.service';
