import { ROLES } from '@seinework/contracts';
import { invitationMessage, passwordResetMessage } from './messages';

describe('messages', () => {
  const expiresAt = new Date('2026-12-09T17:30:00Z');

  it.each(ROLES)('invites a future %s with a one-time link under the public origin', (role) => {
    const message = invitationMessage({ to: 'new@example.test', role, invitedBy: 'Ada Admin', token: 'tok_123-abc', publicOrigin: 'https://seinework.example.test/', expiresAt });
    expect(message.to).toBe('new@example.test');
    expect(message.text.split('\n')).toContain('https://seinework.example.test/invitation/tok_123-abc');
    expect(message.text).toContain('2026-12-09 17:30 UTC');
    expect(message.text).toContain('Ada Admin');
  });

  it('sends a reset link that says what a reset does', () => {
    const message = passwordResetMessage({ to: 'a@example.test', name: 'Ana', token: 'r3s3t', publicOrigin: 'http://127.0.0.1:4300', expiresAt });
    expect(message.text.split('\n')).toContain('http://127.0.0.1:4300/reset-password/r3s3t');
    expect(message.text).toMatch(/^Hello Ana,/);
    expect(message.text).toContain('signs you out everywhere else');
  });
});
