/** The sharing feature's public surface: the public page's HTML shell, mounted by the app. */
export { sharedPageShell } from './sharing.shell';
