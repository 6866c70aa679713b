import { splitMailLinks } from './mail-links';

const ORIGIN = 'http://127.0.0.1:4100';

describe('splitMailLinks', () => {
  it('when a mail holds a link to this app, then it becomes a same-tab path and the text around it stays', () => {
    const parts = splitMailLinks(`Join here: ${ORIGIN}/accept-invite?token=abc123.\nThanks`, ORIGIN);
    expect(parts).toEqual([
      { kind: 'text', text: 'Join here: ' },
      { kind: 'link', text: `${ORIGIN}/accept-invite?token=abc123`, href: '/accept-invite?token=abc123' },
      { kind: 'text', text: '.\nThanks' },
    ]);
  });

  it('when a link points at another origin, then it stays plain text', () => {
    const text = 'Look at https://elsewhere.example/reset?token=1 and http://127.0.0.1:9999/x';
    expect(splitMailLinks(text, ORIGIN)).toEqual([{ kind: 'text', text }]);
  });

  it('when an address is not http(s), then it is never a link', () => {
    const text = 'javascript:alert(1) ftp://127.0.0.1:4100/file data:text/html,hi';
    expect(splitMailLinks(text, ORIGIN)).toEqual([{ kind: 'text', text }]);
  });

  it('when the origin is unknown, then nothing becomes a link', () => {
    expect(splitMailLinks(`${ORIGIN}/reset-password?token=x`, '').every((p) => p.kind === 'text')).toBe(true);
  });

  it('when a mail has two links, then both are links in order', () => {
    const parts = splitMailLinks(`${ORIGIN}/a then (${ORIGIN}/b#c)`, ORIGIN);
    expect(parts.filter((p) => p.kind === 'link').map((p) => (p.kind === 'link' ? p.href : ''))).toEqual(['/a', '/b#c']);
  });
});
