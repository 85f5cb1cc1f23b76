import { describe, expect, it } from 'vitest';
import { signUpInputSchema } from '@shared/schemas/auth';
import { joinCodeSchema } from '@shared/schemas/cohorts';

describe('signUpInputSchema', () => {
  it.each([
    [{ email: 'Ruth@Example.org ', password: 'tomato-basin-clay', displayName: 'Ruth' }, 'ruth@example.org'],
    [{ email: 'ines@example.org', password: 'x'.repeat(200), displayName: ' Inés ' }, 'ines@example.org'],
  ])('accepts %j and normalises the e-mail', (input, email) => {
    const r = signUpInputSchema.safeParse(input);
    expect(r.success).toBe(true);
    expect(r.data?.email).toBe(email);
    expect(r.data?.role).toBe('grower');
  });

  it.each([
    [{ email: 'nope', password: 'tomato-basin-clay', displayName: 'A' }, 'email'],
    [{ email: 'a@b.org', password: 'short', displayName: 'A' }, 'password'],
    [{ email: 'a@b.org', password: 'x'.repeat(201), displayName: 'A' }, 'password'],
    [{ email: 'a@b.org', password: 'tomato-basin-clay', displayName: '   ' }, 'displayName'],
    [{ email: 'a@b.org', password: 'tomato-basin-clay', displayName: 'A', role: 'admin' }, 'role'],
  ])('refuses %j at %s', (input, field) => {
    const r = signUpInputSchema.safeParse(input);
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path.join('.'))).toContain(field);
  });
});

describe('joinCodeSchema', () => {
  it.each([
    ['k7qm-4xpa', 'K7QM4XPA'],
    [' K7QM 4XPA ', 'K7QM4XPA'],
  ])('normalises %j to %s', (input, out) => {
    expect(joinCodeSchema.parse(input)).toBe(out);
  });
  it.each([['K7QM4XP0'], ['K7QM4XP'], ['IIIIIIII'], ['']])('refuses %j (look-alike characters or wrong length)', (input) => {
    expect(joinCodeSchema.safeParse(input).success).toBe(false);
  });
});
