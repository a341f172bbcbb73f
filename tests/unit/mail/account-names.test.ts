import { describe, expect, it } from 'vitest';
import { createOrganisationRequest, signUpRequest } from '../../../shared/schemas/accounts.js';

const base = { name: 'Aino Laaksonen', email: 'aino@estuary.example', password: 'backpressure-watch-2026', organisationName: 'Estuary Generating Station' };
const messages = (input: unknown) => {
  const r = signUpRequest.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
};

describe('names people type are plain text of a bounded length', () => {
  it('accepts ordinary names', () => {
    expect(messages(base)).toEqual([]);
    expect(messages({ ...base, name: 'José O’Neill-Smith', organisationName: 'Northmere Power Co.' })).toEqual([]);
  });

  it('refuses a link or angle brackets in a person’s or an organisation’s name, with the reason', () => {
    expect(messages({ ...base, name: 'Eve <b>admin</b>' })).toEqual(['name: Use plain text: no links and no < or >']);
    expect(messages({ ...base, organisationName: 'Claim at https://evil.example' })).toEqual(['organisationName: Use plain text: no links and no < or >']);
    expect(messages({ ...base, organisationName: 'Go to www.evil.example' })).toEqual(['organisationName: Use plain text: no links and no < or >']);
    expect(createOrganisationRequest.safeParse({ name: 'http://evil.example' }).success).toBe(false);
  });

  it('bounds the length of names', () => {
    expect(messages({ ...base, name: 'A'.repeat(80) })).toEqual([]);
    expect(messages({ ...base, name: 'A'.repeat(81) })).toHaveLength(1);
    expect(messages({ ...base, organisationName: 'O'.repeat(121) })).toHaveLength(1);
  });
});
