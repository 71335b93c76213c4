import { describe, expect, it } from 'vitest';
import { digestHeaders, inlineBodyStyles, renderDigest } from '@/lib/mail/digest';
import { signInLinkMail } from '@/lib/mail/templates';
import { renderMarkdown, type LinkResolution } from '@/lib/markdown/render';

// The e-mails are built with React Email: table layout, inline styles, both parts present.

const base = 'https://club.example';
const unsubscribeUrl = `${base}/unsubscribe?token=abc.def`;
const note = {
  slug: '2027-05-09-candle-cutting',
  title: 'Candle cutting & <feeding>',
  meetingDate: '2027-05-09',
  authorName: 'Marla Quayle',
  body: '- cut the strong candles first\n- leave the weak ones\n\nSee [the pinch](/answers/sharedAns0001).',
};
const resolutions = new Map<string, LinkResolution>([['a:sharedAns0001', { state: 'card', meta: 'Pinch · Scots pine · 10 May 2027 · asked by Wren Alder' }]]);

async function digest() {
  const html = await renderMarkdown(note.body, { resolveLink: (l) => (l.type === 'answer' ? resolutions.get(`a:${l.id}`) : undefined) });
  return renderDigest({ clubName: 'Riverside Pine Study Group', baseUrl: base, note, html, resolutions, unsubscribeUrl });
}

describe('digest e-mail', () => {
  it('HTML part: a full document, styles inline and no <style> block, title escaped, the list kept', async () => {
    const { html } = await digest();
    expect(html).toMatch(/^<!DOCTYPE html/i);
    expect(html).not.toMatch(/<style/i);
    expect(html).toContain('role="presentation"'); // React Email's table layout
    expect(html).toMatch(/<h1[^>]*style="[^"]*font-family:Georgia/);
    expect(html).toContain('Candle cutting &amp; &lt;feeding&gt;');
    expect(html).not.toContain('<feeding>');
    expect(html).toMatch(/<li>cut the strong candles first<\/li>/);
    // The preview card of the linked answer carries its styles inline.
    expect(html).toMatch(/<a href="https:\/\/club\.example\/answers\/sharedAns0001" class="[^"]*\blink-card" style="display:inline-block;[^"]+"/);
    expect(html).not.toMatch(/href="\//);
  });

  it('HTML part keeps the unsubscribe link; the headers offer one-click unsubscribe', async () => {
    const mail = await digest();
    expect(mail.html).toMatch(/<a href="https:\/\/club\.example\/unsubscribe\?token=abc\.def"[^>]*>Stop these e-mails<\/a>/);
    expect(mail.headers).toEqual({
      'List-Unsubscribe': `<${base}/api/unsubscribe?token=abc.def>`,
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    });
    expect(digestHeaders(unsubscribeUrl)).toEqual(mail.headers);
  });

  it('text part: plain text with the list, the card details and the unsubscribe link', async () => {
    const { text } = await digest();
    expect(text).not.toMatch(/<(a|p|li|table)\b/);
    expect(text).toContain('Candle cutting & <feeding>');
    expect(text).toMatch(/^[-*] cut the strong candles first$/m);
    expect(text).toContain(`[the pinch](${base}/answers/sharedAns0001) (Pinch · Scots pine · 10 May 2027 · asked by Wren Alder)`);
    expect(text).toContain(`Stop them: ${unsubscribeUrl}`);
  });

  it('inlines only the classes it knows, leaving other markup alone', () => {
    expect(inlineBodyStyles('<span class="link-note">(answer not available)</span>')).toMatch(/^<span class="link-note" style="font-style:italic;/);
    expect(inlineBodyStyles('<p class="other">x</p><p>y</p>')).toBe('<p class="other">x</p><p>y</p>');
  });
});

describe('sign-in e-mail', () => {
  it('has the link in both parts, inline styles, no <style> block', async () => {
    const url = `${base}/api/auth/callback/email?token=t0k&email=a%40b.example`;
    const mail = await signInLinkMail(url);
    expect(mail.subject).toBe('Your Candlewise sign-in link');
    expect(mail.text).toContain(url);
    expect(mail.html).toContain(`href="${url.replace(/&/g, '&amp;')}"`);
    expect(mail.html).not.toMatch(/<style/i);
    expect(mail.html).toMatch(/style="[^"]*background-color:#33522c/);
  });
});
