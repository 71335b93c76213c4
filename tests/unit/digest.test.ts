import { describe, expect, it } from 'vitest';
import { absolutiseHtml, digestText, renderDigest } from '@/lib/mail/digest';
import { createUnsubscribeToken, UNSUBSCRIBE_TTL_MS, verifyUnsubscribeToken } from '@/lib/mail/unsubscribe';
import { renderMarkdown, type LinkResolution } from '@/lib/markdown/render';

const SECRET = 'unit-test-secret-0123456789abcdef';
const base = 'https://club.example';

const note = {
  slug: '2027-03-14-spring-candles',
  title: 'Spring candles & <pinching>',
  meetingDate: '2027-03-14',
  authorName: 'Marla Quayle',
  body: [
    'We compared [the Scots pinch](/answers/sharedAns0001) with [a private one](/answers/privateAns001).',
    '',
    'Read about [Scots pine](/species/pinus-sylvestris) and the [club site](https://example.org/x).',
  ].join('\n'),
};

const resolutions = new Map<string, LinkResolution>([
  ['a:sharedAns0001', { state: 'card', meta: 'Pinch · Scots pine · 10 May 2027 · asked by Wren Alder' }],
  ['a:privateAns001', { state: 'unavailable', note: '(answer not available)' }],
  ['s:pinus-sylvestris', { state: 'card', meta: 'Scots pine (Pinus sylvestris) · single flush' }],
]);

async function digest() {
  const html = await renderMarkdown(note.body, {
    resolveLink: (l) => resolutions.get(l.type === 'answer' ? `a:${l.id}` : `s:${l.slug}`),
  });
  return renderDigest({ clubName: 'Riverside Pine Study Group', baseUrl: base, note, html, resolutions, unsubscribeUrl: `${base}/unsubscribe?token=abc.def` });
}

describe('digest rendering', () => {
  it('has a subject naming the club, the note and the meeting date', async () => {
    expect((await digest()).subject).toBe('Riverside Pine Study Group: Spring candles & <pinching> (meeting of 14 March 2027)');
  });

  it('HTML part: escaped title, absolute links, preview cards, private answer as text, unsubscribe link', async () => {
    const { html } = await digest();
    expect(html).toMatch(/<h1 style="[^"]*">Spring candles &amp; &lt;pinching&gt;<\/h1>/);
    expect(html).toContain(`href="${base}/answers/sharedAns0001"`);
    expect(html).toContain(`href="${base}/species/pinus-sylvestris"`);
    expect(html).toContain('href="https://example.org/x"');
    expect(html).toContain('asked by Wren Alder');
    expect(html).not.toContain('privateAns001');
    expect(html).toMatch(/a private one <span class="link-note" style="[^"]*">\(answer not available\)<\/span>/);
    expect(html).toMatch(new RegExp(`<a href="${base}/unsubscribe\\?token=abc\\.def"[^>]*>Stop these e-mails</a>`));
    expect(html).toContain(`href="${base}/notes/2027-03-14-spring-candles"`);
    expect(html).not.toMatch(/href="\//);
  });

  it('text part: readable Markdown with absolute links, card details, no private answer address', async () => {
    const { text } = await digest();
    expect(text).toContain('Riverside Pine Study Group — notes from the meeting of 14 March 2027');
    expect(text).toContain(`[the Scots pinch](${base}/answers/sharedAns0001) (Pinch · Scots pine · 10 May 2027 · asked by Wren Alder)`);
    expect(text).toContain('a private one (answer not available)');
    expect(text).not.toContain('privateAns001');
    expect(text).toContain(`[Scots pine](${base}/species/pinus-sylvestris) (Scots pine (Pinus sylvestris) · single flush)`);
    expect(text).toContain(`Stop them: ${base}/unsubscribe?token=abc.def`);
    // Plain text: the title as written, no HTML.
    expect(text).toContain('\nSpring candles & <pinching>\n');
    expect(text).not.toMatch(/<(a|span|p)\b/);
  });

  it('a reference-style link to a private answer points to the note instead', () => {
    const text = digestText({ baseUrl: base, resolutions, note: { ...note, body: 'See [that][p].\n\n[p]: /answers/privateAns001' } });
    expect(text).not.toContain('privateAns001');
    expect(text).toContain(`${base}/notes/2027-03-14-spring-candles`);
  });

  it('absolutises only root-relative URLs', () => {
    expect(absolutiseHtml('<a href="/a">x</a><a href="//cdn.example/y">y</a><a href="https://o.example/">z</a>', base)).toBe(
      `<a href="${base}/a">x</a><a href="//cdn.example/y">y</a><a href="https://o.example/">z</a>`,
    );
  });
});

describe('unsubscribe token', () => {
  const now = Date.UTC(2027, 2, 14);

  it('a fresh token names its member', () => {
    const t = createUnsubscribeToken('user-123', SECRET, now);
    expect(verifyUnsubscribeToken(t, SECRET, now + 1000)).toEqual({ ok: true, userId: 'user-123', list: 'digest' });
  });

  it('a tampered payload, a swapped signature or another secret is refused', () => {
    const t = createUnsubscribeToken('user-123', SECRET, now);
    const [payload, mac] = t.split('.');
    const forged = Buffer.from(JSON.stringify({ u: 'user-999', x: now + UNSUBSCRIBE_TTL_MS })).toString('base64url');
    expect(verifyUnsubscribeToken(`${forged}.${mac}`, SECRET, now)).toEqual({ ok: false, reason: 'bad_signature' });
    const other = createUnsubscribeToken('user-999', SECRET, now).split('.')[1];
    expect(verifyUnsubscribeToken(`${payload}.${other}`, SECRET, now)).toEqual({ ok: false, reason: 'bad_signature' });
    expect(verifyUnsubscribeToken(t, 'another-secret-0123456789abcdef', now)).toEqual({ ok: false, reason: 'bad_signature' });
    const flipped = mac[0] === 'A' ? `B${mac.slice(1)}` : `A${mac.slice(1)}`;
    expect(verifyUnsubscribeToken(`${payload}.${flipped}`, SECRET, now).ok).toBe(false);
  });

  it('an expired token is refused as expired', () => {
    const t = createUnsubscribeToken('user-123', SECRET, now);
    expect(verifyUnsubscribeToken(t, SECRET, now + UNSUBSCRIBE_TTL_MS - 1).ok).toBe(true);
    expect(verifyUnsubscribeToken(t, SECRET, now + UNSUBSCRIBE_TTL_MS + 1)).toEqual({ ok: false, reason: 'expired' });
  });

  it('garbage is malformed', () => {
    for (const t of ['', 'abc', 'a.b.c', '.x', 'x.']) expect(verifyUnsubscribeToken(t, SECRET, now).ok).toBe(false);
  });
});
