import { createStore, del, entries, get, set } from 'idb-keyval';

// One IndexedDB store for everything the kiosk must not lose: check drafts, signed checks waiting to send, where a
// badge was when the tablet locked. IndexedDB survives a reload and a crashed tab, and writes are transactional.
const store = createStore('gaugewalk-kiosk', 'tablet');

// Writes to one key are applied in the order they were asked, so a late save never overwrites a later discard.
const pending = new Map<string, Promise<unknown>>();
function inOrder<T>(key: string, write: () => Promise<T>): Promise<T> {
  const next = (pending.get(key) ?? Promise.resolve()).then(write, write);
  pending.set(key, next);
  void next.finally(() => {
    if (pending.get(key) === next) pending.delete(key);
  });
  return next;
}

export async function tabletGet<T>(key: string): Promise<T | undefined> {
  await pending.get(key)?.catch(() => undefined);
  return get<T>(key, store);
}

export const tabletSet = (key: string, value: unknown): Promise<void> =>
  inOrder(key, () => set(key, value, store));

export const tabletDelete = (key: string): Promise<void> => inOrder(key, () => del(key, store));

export async function tabletEntries<T>(prefix: string): Promise<[string, T][]> {
  await Promise.all([...pending.values()].map((p) => p.catch(() => undefined)));
  const all = await entries<IDBValidKey, T>(store);
  return all.filter(
    (entry): entry is [string, T] => typeof entry[0] === 'string' && entry[0].startsWith(prefix),
  );
}
