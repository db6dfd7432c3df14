/** The bench feature's public surface: the build's sheets with their verdicts, for the build sheet. */
export { list as listSheets } from './bench.service';
