import path from 'node:path';
import { runFake } from '../run-fake';
import { startObjectStore } from './object-store';

// Entry for `npm start` (api/scripts/stack.mjs): port, folder and bucket come from the environment.
runFake(
  'object store',
  () =>
    startObjectStore({
      port: Number(process.env.OBJECT_STORE_PORT ?? 4569),
      directory: path.resolve(process.env.OBJECT_STORE_DIR ?? '.data/object-store'),
      bucket: process.env.S3_BUCKET ?? 'loomwright-photos',
    }),
  (store) => `S3-compatible store at ${store.url}, bucket ${store.bucket}`,
  (store) => store.close(),
);
