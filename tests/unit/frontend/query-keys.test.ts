import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { organisationKey, plantsKey, unitKey } from '@frontend/lib/query-keys';
import { unitQueryOptions } from '@frontend/features/units/api/get-unit';
import { plantsQueryOptions } from '@frontend/features/plants/api/get-plants';
import { eventsQueryOptions } from '@frontend/features/events/api/get-events';
import { unitImportsQueryOptions } from '@frontend/features/imports/api/get-imports';
import { importQueryOptions } from '@frontend/features/imports/api/get-import';
import { healthQueryOptions, unitHealthKey } from '@frontend/features/health/api/get-health';
import { cleaningMethodsQueryOptions } from '@frontend/features/cleaning-methods/api/get-cleaning-methods';
import { membersQueryOptions } from '@frontend/features/members/api/get-members';

const startsWith = (key: readonly unknown[], prefix: readonly unknown[]) => expect(key.slice(0, prefix.length)).toEqual([...prefix]);

describe('query keys', () => {
  it('invalidating a unit reaches the unit, its events, its imports and every health period of it', () => {
    expect(unitQueryOptions('o1', 'u1').queryKey).toEqual([...unitKey('o1', 'u1')]);
    startsWith(eventsQueryOptions('o1', 'u1').queryKey, unitKey('o1', 'u1'));
    startsWith(unitImportsQueryOptions('o1', 'u1').queryKey, unitKey('o1', 'u1'));
    startsWith(healthQueryOptions('o1', 'u1', { breakdownBy: 'month', from: '2025-01-01' }).queryKey, unitHealthKey('o1', 'u1'));
    startsWith(unitHealthKey('o1', 'u1'), unitKey('o1', 'u1'));
  });

  it('invalidating an organisation reaches its plants, units, library and members, and nothing of another organisation', () => {
    for (const key of [
      plantsQueryOptions('o1').queryKey,
      unitKey('o1', 'u1'),
      importQueryOptions('o1', 'i1').queryKey,
      cleaningMethodsQueryOptions('o1').queryKey,
      membersQueryOptions('o1').queryKey,
    ]) {
      startsWith(key, organisationKey('o1'));
      expect(key.slice(0, 2)).not.toEqual([...organisationKey('o2')]);
    }
    expect(plantsQueryOptions('o1').queryKey).toEqual([...plantsKey('o1')]);
  });

  it('no feature invalidates or writes a query under a key spelled out by hand', () => {
    const root = path.resolve(import.meta.dirname, '../../../frontend/src/features');
    const files = readdirSync(root, { recursive: true, encoding: 'utf8' }).filter((f) => /\.tsx?$/.test(f));
    const literal = /(invalidateQueries|setQueryData|removeQueries|refetchQueries|cancelQueries)\(\s*(\{\s*queryKey:\s*)?\[/;
    expect(files.filter((f) => literal.test(readFileSync(path.join(root, f), 'utf8')))).toEqual([]);
  });
});
