import { join, resolve } from 'node:path';
import { loadPhotoStoreConfig } from '../config';
import { findFreePort } from '../db/local-server';
import { startFakeObjectStore } from './fake-object-store';
import { createPhotoStore, type PhotoStore } from './photo-store';

/**
 * The photo store a command (backup, restore, photo migration) works on: the one PHOTO_STORE_ENDPOINT names;
 * otherwise the local fake of `npm start`, on the files in DATA_DIR/objects, started for the job on a port of its
 * own and stopped afterwards (reading beside a running `npm start` is safe: both read the same files).
 */
export async function targetPhotoStore(
  env: NodeJS.ProcessEnv = process.env,
): Promise<{ store: PhotoStore; how: string; stop: () => Promise<void> }> {
  if (env.PHOTO_STORE_ENDPOINT) {
    const store = createPhotoStore(loadPhotoStoreConfig(env));
    return { store, how: store.where, stop: async () => store.close() };
  }
  const directory = join(resolve(env.DATA_DIR ?? '.data'), 'objects');
  const fake = await startFakeObjectStore({ directory, port: await findFreePort(0) });
  const store = createPhotoStore(loadPhotoStoreConfig({ ...env, ...fake.env }));
  return {
    store,
    how: `the local photo store in ${directory}`,
    stop: async () => {
      store.close();
      await fake.stop();
    },
  };
}
