// npm run storage:migrate [-- --dry-run] [-- --remove-local] [-- --from DIR]
//
// Copies every file of the local-disk store (STORAGE_DIR, .data/uploads by
// default) to the object store the STORAGE=s3 / S3_* settings name, reading
// each copy back and comparing SHA-256. Safe to run again: what the store
// already holds unchanged is skipped. Ends with one line of counts; exits 1
// when any file failed.
import path from 'node:path';
import { parseArgs } from 'node:util';
import { createLocalDiskStorage } from '@server/lib/storage';
import { createS3Storage } from '@server/lib/storage-s3';
import { objectStoreFromEnv, type ObjectStoreSettings } from '@server/storage-config';
import { migrateStorage } from './lib/storage-migrate';

const { values: args } = parseArgs({
  options: {
    from: { type: 'string' },
    'dry-run': { type: 'boolean', default: false },
    'remove-local': { type: 'boolean', default: false },
    quiet: { type: 'boolean', default: false },
  },
});

function fail(message: string, code = 2): never {
  console.error(`storage:migrate: ${message}`);
  process.exit(code);
}

let settings: ObjectStoreSettings | null;
try {
  settings = objectStoreFromEnv();
} catch (err) {
  fail((err as Error).message);
}
if (!settings) {
  fail(
    'name the object store to move to: STORAGE=s3, S3_BUCKET and, for a store other than AWS, ' +
      'S3_ENDPOINT (and S3_FORCE_PATH_STYLE=1); credentials as the AWS SDK reads them (AWS_ACCESS_KEY_ID …)',
  );
}
const fromDir = path.resolve(args.from ?? process.env.STORAGE_DIR ?? '.data/uploads');
const from = createLocalDiskStorage(fromDir);
const to = createS3Storage(settings);
const where = `bucket ${settings.bucket}${settings.endpoint ? ` at ${settings.endpoint}` : ''}`;

try {
  // Reach the bucket once before reading thousands of files.
  try {
    await to.head('headroom-storage-migrate/check');
  } catch (err) {
    fail(`cannot reach ${where}: ${(err as Error).message}`);
  }
  console.log(
    `${args['dry-run'] ? 'Dry run: ' : ''}moving files from ${fromDir} to ${where}` +
      (args['remove-local'] ? ', removing each local file once its copy is verified' : ''),
  );
  const report = await migrateStorage({
    from,
    to,
    dryRun: args['dry-run'],
    removeLocal: args['remove-local'],
    log: (line) => {
      if (!args.quiet || line.startsWith('FAILED')) console.log(line);
    },
  });
  const parts = args['dry-run']
    ? [`${report.wouldCopy.length} to copy`, `${report.alreadyThere.length} already there`]
    : [
        `${report.copied.length} copied and verified`,
        `${report.alreadyThere.length} already there`,
        ...(args['remove-local'] ? [`${report.removed.length} local files removed`] : []),
        `${report.failed.length} failed`,
      ];
  console.log(parts.join(', '));
  if (report.failed.length) {
    console.log('Run it again to retry the failed files; nothing local was removed for them.');
    process.exitCode = 1;
  }
} finally {
  to.close();
}
