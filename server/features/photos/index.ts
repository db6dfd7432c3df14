/** The photo log's public surface: the image checks other features reuse for their own uploads. */
export { acceptedFormats, processPhoto, type ProcessedPhoto } from './photos.images';
