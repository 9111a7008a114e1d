import path from 'node:path';
import { startObjectStore } from './object-store';

// Entry for `npm start` (api/scripts/stack.mjs): port, folder and bucket come from the environment.
async function main() {
  const store = await startObjectStore({
    port: Number(process.env.OBJECT_STORE_PORT ?? 4569),
    directory: path.resolve(process.env.OBJECT_STORE_DIR ?? '.data/object-store'),
    bucket: process.env.S3_BUCKET ?? 'loomwright-photos',
  });
  console.log(`[object store] S3-compatible store at ${store.url}, bucket ${store.bucket}`);
  const stop = () => void store.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((error: Error) => {
  console.error(`[object store] could not start: ${error.message}`);
  process.exit(1);
});
