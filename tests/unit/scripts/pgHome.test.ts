// Where a clone's private PostgreSQL cluster lives (scripts/lib.mjs): inside the clone unless we run as root and
// the postgres user cannot enter the clone's folder (a clone in a 0700 folder such as `mktemp -d` gives).
import { describe, expect, it } from 'vitest';
import { choosePgHome, sharedPgRoot } from '../../../scripts/lib.mjs';

const base = { root: '/tmp/tmp.abc/f', dataDir: '/tmp/tmp.abc/f/.data', recorded: null, hasClusterInData: false };

describe('choosePgHome', () => {
  it('keeps the cluster in .data/ for an ordinary user, without asking whether postgres can enter', () => {
    const home = choosePgHome({ ...base, isRoot: false, postgresCanReach: () => { throw new Error('not asked'); } });
    expect(home).toBe(base.dataDir);
  });

  it('keeps the cluster in .data/ as root when the postgres user can enter the clone', () => {
    expect(choosePgHome({ ...base, isRoot: true, postgresCanReach: () => true })).toBe(base.dataDir);
  });

  it('moves the cluster to a per-clone folder under /var/lib/falloff when the postgres user cannot enter', () => {
    const home = choosePgHome({ ...base, isRoot: true, postgresCanReach: () => false });
    expect(home.startsWith(`${sharedPgRoot}/f-`)).toBe(true);
    // Keyed by the clone's path: two clones named alike get two clusters; the same clone always the same one.
    const other = choosePgHome({ ...base, root: '/tmp/tmp.xyz/f', isRoot: true, postgresCanReach: () => false });
    expect(other).not.toBe(home);
    expect(choosePgHome({ ...base, isRoot: true, postgresCanReach: () => false })).toBe(home);
  });

  it('never moves a cluster that already exists or was recorded', () => {
    expect(choosePgHome({ ...base, isRoot: true, hasClusterInData: true, postgresCanReach: () => false })).toBe(base.dataDir);
    expect(choosePgHome({ ...base, isRoot: true, recorded: '/var/lib/falloff/f-123', postgresCanReach: () => true })).toBe('/var/lib/falloff/f-123');
  });
});
