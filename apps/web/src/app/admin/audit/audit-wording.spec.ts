import { actionInWords, subjectInWords } from './audit-wording';

describe('audit wording', () => {
  it('puts sign-in events in plain words and names the area of other changes', () => {
    expect(actionInWords('auth.signed-in')).toBe('Signed in');
    expect(actionInWords('auth.sign-in-failed')).toBe('Sign in failed');
    expect(actionInWords('user.created')).toBe('User: created');
    expect(actionInWords('web.version-published')).toBe('Web: version published');
    expect(actionInWords('seeded')).toBe('Seeded');
  });

  it('shortens a subject to its kind and the first block of its id', () => {
    expect(subjectInWords('user:2cbcece5-f456-4e77-9435-29433aad7301')).toEqual({ kind: 'user', id: '2cbcece5' });
    expect(subjectInWords('web:42')).toEqual({ kind: 'web', id: '42' });
    expect(subjectInWords('system')).toEqual({ kind: 'system', id: '' });
  });
});
