import { afterEach, describe, expect, it, vi } from 'vitest';
import { loadConfig } from '@server/config';
import { renderMail } from '@server/features/mail/mail.templates';
import { retryDelayMs } from '@server/features/mail/mail.worker';
import { hashToken, isTokenShaped, newToken, redactTokens } from '@server/lib/tokens';

const env = { DATABASE_URL: 'postgres://headroom@127.0.0.1:5432/x' };

describe('renderMail', () => {
  const mail = renderMail({
    subject: 'Join “<Gravel & Hauler>”',
    heading: 'Join “<Gravel & Hauler>” as crew',
    body: 'First paragraph.\n\nSecond line one\nline two.',
    action: {
      label: 'Accept the invitation',
      url: 'https://headroom.example/invite/abc?x=1&y="2"',
    },
    footer: 'Ignore this if unexpected.',
  });

  it('gives a plain-text part with the heading, paragraphs, the link and the footer', () => {
    expect(mail.text).toContain('Join “<Gravel & Hauler>” as crew');
    expect(mail.text).toContain('First paragraph.\n\nSecond line one\nline two.');
    expect(mail.text).toContain(
      'Accept the invitation:\nhttps://headroom.example/invite/abc?x=1&y="2"',
    );
    expect(mail.text).toContain('--\nIgnore this if unexpected.');
  });

  it('gives an HTML part in Headroom’s look with everything escaped', () => {
    expect(mail.html).toMatch(/background:#1b2230[^>]*>Headroom</);
    expect(mail.html).toMatch(/background:#d9622b/);
    expect(mail.html).toContain('&lt;Gravel &amp; Hauler&gt;');
    expect(mail.html).not.toContain('<Gravel');
    expect(mail.html).toContain(
      'href="https://headroom.example/invite/abc?x=1&amp;y=&quot;2&quot;"',
    );
    expect(mail.html).toContain('Second line one<br>line two.');
    expect(mail.html).not.toMatch(/<script|<link|<style/i);
  });

  it('leaves the button out when there is no action', () => {
    const plain = renderMail({ subject: 's', heading: 'h', body: 'b' });
    expect(plain.html).not.toContain('#d9622b');
    expect(plain.text).not.toContain('http');
  });
});

describe('retryDelayMs', () => {
  it('doubles from 30 seconds and stops growing at an hour', () => {
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([30_000, 60_000, 120_000, 240_000]);
    expect(retryDelayMs(8)).toBe(3_600_000);
    expect(retryDelayMs(30)).toBe(3_600_000);
  });
});

describe('link tokens', () => {
  it('are 32 random bytes in base64url, stored only as their SHA-256', () => {
    const a = newToken();
    const b = newToken();
    expect(a.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(Buffer.from(a.token, 'base64url')).toHaveLength(32);
    expect(a.token).not.toBe(b.token);
    expect(a.hash).toBe(hashToken(a.token));
    // SHA-256 of "abc", FIPS 180-2 appendix B.1.
    expect(hashToken('abc')).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
    );
    expect(isTokenShaped(a.token)).toBe(true);
    expect(isTokenShaped(`${a.token}x`)).toBe(false);
    expect(isTokenShaped('../../etc')).toBe(false);
  });

  it('are kept out of logged URLs', () => {
    const { token } = newToken();
    expect(redactTokens(`/api/invitations/${token}/accept`)).toBe(
      '/api/invitations/[token]/accept',
    );
    expect(redactTokens(`/reset-password/${token}?x=1`)).toBe('/reset-password/[token]?x=1');
    const id = '3f2b8c1e-9d4a-4b7e-8f00-123456789abc';
    expect(redactTokens(`/api/builds/${id}/parts`)).toBe(`/api/builds/${id}/parts`);
  });
});

describe('mail settings', () => {
  afterEach(() => vi.restoreAllMocks());

  it('uses the catcher without SMTP settings, with links on 127.0.0.1:PORT', () => {
    const c = loadConfig({ ...env, PORT: '4000' });
    expect(c.mail.smtp).toBeNull();
    expect(c.mail.catcherPort).toBe(2525);
    expect(c.mail.dir).toMatch(/\.data\/mail$/);
    expect(c.appUrl).toBe('http://127.0.0.1:4000');
  });

  it('reads SMTP as a URL or as host, port, user, password and TLS', () => {
    expect(loadConfig({ ...env, SMTP_URL: 'smtps://u:p@mail.example:465' }).mail.smtp).toEqual({
      url: 'smtps://u:p@mail.example:465',
    });
    expect(
      loadConfig({ ...env, SMTP_HOST: 'mail.example', SMTP_USER: 'u', SMTP_PASS: 'p' }).mail.smtp,
    ).toEqual({
      host: 'mail.example',
      port: 587,
      secure: false,
      user: 'u',
      pass: 'p',
    });
    expect(
      loadConfig({ ...env, SMTP_HOST: 'mail.example', SMTP_PORT: '465' }).mail.smtp,
    ).toMatchObject({ port: 465, secure: true });
    expect(loadConfig({ ...env, APP_URL: 'https://headroom.example/' }).appUrl).toBe(
      'https://headroom.example',
    );
  });

  it('refuses to start in production without SMTP, and refuses a bad SMTP_URL', () => {
    const exit = vi.spyOn(process, 'exit').mockImplementation(() => {
      throw new Error('exit');
    });
    const error = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    expect(() => loadConfig({ ...env, NODE_ENV: 'production' })).toThrow('exit');
    expect(String(error.mock.calls.at(-1)?.[0])).toMatch(/SMTP_URL or SMTP_HOST/);
    expect(() => loadConfig({ ...env, SMTP_URL: 'http://mail.example' })).toThrow('exit');
    expect(String(error.mock.calls.at(-1)?.[0])).toMatch(/SMTP_URL/);
    expect(exit).toHaveBeenCalledWith(1);
    expect(
      loadConfig({ ...env, NODE_ENV: 'production', SMTP_URL: 'smtp://mail.example' }).env,
    ).toBe('production');
  });
});
