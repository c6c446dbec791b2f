import { describe, expect, it } from 'vitest';
import { bufferPoolMb } from './local-server';

const GiB = 1024 ** 3;

describe('the private MariaDB instance buffer pool', () => {
  it('when nothing is asked, then it takes a quarter of the memory in whole 128 MB steps, from 128 MB to 8 GB', () => {
    expect(bufferPoolMb({}, 24 * GiB)).toBe(6144);
    expect(bufferPoolMb({}, 3 * GiB)).toBe(768);
    expect(bufferPoolMb({}, 0.25 * GiB)).toBe(128);
    expect(bufferPoolMb({}, 64 * GiB)).toBe(8192);
  });

  it('when MARIADB_BUFFER_POOL_MB is set, then that size is used, and a size below 128 MB or not whole is refused', () => {
    expect(bufferPoolMb({ MARIADB_BUFFER_POOL_MB: '2048' }, 24 * GiB)).toBe(2048);
    expect(() => bufferPoolMb({ MARIADB_BUFFER_POOL_MB: '64' })).toThrow(/128 or more/);
    expect(() => bufferPoolMb({ MARIADB_BUFFER_POOL_MB: '1.5' })).toThrow(/whole number/);
  });
});
