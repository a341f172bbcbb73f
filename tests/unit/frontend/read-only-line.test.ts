import { describe, expect, it } from 'vitest';
import { whyNot } from '@shared/permissions';
import { readOnlyLine } from '@frontend/components/ui/read-only';

describe('the one line that stands where an action would be', () => {
  it('when a viewer may not change the data, it names who may and what they do', () => {
    expect(readOnlyLine(whyNot('data.write'), 'record, change and delete events')).toBe('Only administrators and analysts record, change and delete events.');
  });

  it('when only administrators may manage client groups, it says so', () => {
    expect(readOnlyLine(whyNot('client-groups.manage'), 'create, rename and delete client groups')).toBe(
      'Only administrators create, rename and delete client groups.',
    );
  });

  it('a reason of another shape is kept whole, with the action after it', () => {
    expect(readOnlyLine('The organisation’s subscription has lapsed.', 'import data')).toBe('The organisation’s subscription has lapsed: import data.');
  });
});
