import { describe, expect, it } from 'vitest';
import { invitationMail } from '../../../backend/src/mail/templates.js';

const link = 'http://127.0.0.1:3000/invitation?token=abc123';
const invite = (organisationName: string, inviterName: string) =>
  invitationMail({ to: 'someone@example.test', organisationName, inviterName, role: 'viewer', link, expiresAt: new Date('2026-03-01T00:00:00Z') });

describe('names in e-mails are plain text of a bounded length, without links', () => {
  it('a name carrying a link or markup reaches the mail without the link or the angle brackets', () => {
    const mail = invite('Visit www.evil.example/login now', 'Mallory <a href="https://evil.example/x">click here</a>');
    for (const part of [mail.subject, mail.text]) {
      expect(part).not.toMatch(/evil\.example|https:\/\/evil|www\./);
      expect(part).not.toMatch(/[<>]/);
    }
    expect(mail.text).toContain('Mallory');
    // The one link the mail is meant to carry is still there.
    expect(mail.text).toContain(link);
    expect(mail.text.match(/https?:\/\//g)).toHaveLength(1);
  });

  it('a bare domain or an e-mail address in a name is left out too', () => {
    const mail = invite('Acme evil.example Power', 'Eve reset-here@evil.example');
    expect(mail.subject).not.toContain('evil.example');
    expect(mail.text).not.toContain('evil.example');
  });

  it('a very long name is cut to a bounded length and line breaks cannot add lines', () => {
    const mail = invite('Northmere '.repeat(60), 'Ann\nDear user, your account is locked.\r\nBcc: all');
    expect(mail.subject.length).toBeLessThanOrEqual(200);
    expect(mail.subject).not.toMatch(/[\r\n]/);
    expect(mail.text.split('\n')[0]).toContain('Ann Dear user');
    expect(mail.text.split('\n')[0]?.length).toBeLessThan(260);
  });

  it('ordinary names stay as they are', () => {
    const mail = invite('Northmere Power Co.', 'José O’Neill-Smith');
    expect(mail.subject).toBe('José O’Neill-Smith invited you to Northmere Power Co. on Cleancase');
  });
});
