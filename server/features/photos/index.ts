/** The photo log's public surface: the image checks other features reuse for their own uploads. */
export { acceptedFormats, processPhoto, type ProcessedPhoto } from './photos.images';
/** Public photos, for the sharing feature. */
export {
  isPublic,
  listPublic,
  publicFile,
  publicIds,
  setPublic,
  type PublicPhoto,
} from './photos.public';
